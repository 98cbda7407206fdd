using System.Text.Json;

namespace LongRecord.Synthesis.Scenarios;

/// <summary>Reads one timeline segment, checking that every parameter applies to its rhythm and is in range.</summary>
internal static class SegmentReader
{
    private static readonly string[] s_allParameters =
    [
        "rampUpS", "rampDownS", "pShape", "warmUpBeats", "retrogradeP", "endPauseS", "atrialRateBpm", "conduction",
        "conductionRatio", "rrCv", "fibrillatoryWaveScale", "avDissociation", "couplingFraction", "morphology", "ectopy", "events",
    ];

    public static ScenarioSegment? Read(JsonElement element, int index, List<string> errors)
    {
        var probe = new JsonObjectReader(element, $"segments[{index}]", errors);
        if (!probe.IsObject)
        {
            return null;
        }

        var rhythmText = probe.String("rhythm", required: true, allowed: RhythmNames.All.ToArray());
        if (rhythmText is null || !RhythmNames.TryParse(rhythmText, out var kind))
        {
            return null;
        }

        var r = probe.Child(element, $"segments[{index}] ({rhythmText})");
        r.Raw("rhythm");
        var duration = r.Number("durationS", 1, 14 * 86400.0, required: true);

        double? rate = null;
        if (SegmentRules.RateRange(kind) is (double min, double max))
        {
            rate = r.Number("rateBpm", min, max);
        }

        var extras = SegmentRules.Extras(kind);
        foreach (var p in s_allParameters)
        {
            if (!extras.Contains(p) && r.Has(p))
            {
                r.Error(p, $"does not apply to rhythm {rhythmText}");
                r.Raw(p);
            }
        }

        double? Num(string field, double lo, double hi) => extras.Contains(field) ? r.Number(field, lo, hi) : null;
        string? Str(string field, string[] allowed) => extras.Contains(field) ? r.String(field, allowed: allowed) : null;

        var atrialRange = kind == RhythmKind.AtrialFlutter ? (200.0, 350.0) : (40.0, 120.0);
        var segment = new ScenarioSegment
        {
            Rhythm = kind,
            DurationS = duration ?? 1,
            RateBpm = rate,
            RampUpS = Num("rampUpS", 1, 1800),
            RampDownS = Num("rampDownS", 1, 1800),
            PShape = Str("pShape", SegmentRules.EctopicPShapes),
            WarmUpBeats = extras.Contains("warmUpBeats") ? r.Integer("warmUpBeats", 0, 30) : null,
            RetrogradeP = extras.Contains("retrogradeP") ? r.Bool("retrogradeP") : null,
            EndPauseS = Num("endPauseS", 0, 4),
            AtrialRateBpm = Num("atrialRateBpm", atrialRange.Item1, atrialRange.Item2),
            Conduction = Str("conduction", SegmentRules.FlutterConduction),
            ConductionRatio = extras.Contains("conductionRatio") ? ReadRatio(r) : null,
            RrCv = Num("rrCv", 0.02, 0.5),
            FibrillatoryWaveScale = Num("fibrillatoryWaveScale", 0, 5),
            AvDissociation = extras.Contains("avDissociation") ? r.Bool("avDissociation") : null,
            CouplingFraction = Num("couplingFraction", 0.4, 0.9),
            Morphology = Str("morphology", SegmentRules.VentricularShapes),
            Ectopy = extras.Contains("ectopy") ? ReadEctopy(r) : null,
            Events = extras.Contains("events") ? ReadEvents(r, duration ?? double.MaxValue) : [],
        };

        if (duration is double d && (segment.RampUpS ?? 0) + (segment.RampDownS ?? 0) > d)
        {
            r.Error("rampUpS", $"rampUpS + rampDownS must not exceed durationS ({JsonObjectReader.F(d)})");
        }

        r.RejectUnknown();
        return duration is null ? null : segment;
    }

    private static string? ReadRatio(JsonObjectReader r)
    {
        var text = r.String("conductionRatio");
        if (text is null)
        {
            return null;
        }

        var parts = text.Split(':');
        if (parts.Length != 2 || !int.TryParse(parts[0], out var p) || !int.TryParse(parts[1], out var q) || p < 2 || p > 8 || q != p - 1)
        {
            r.Error("conductionRatio", $"must be P:(P−1) with P from 2 to 8, for example 3:2 (is '{text}')");
            return null;
        }

        return text;
    }

    private static EctopySettings? ReadEctopy(JsonObjectReader parent)
    {
        var r = parent.Object("ectopy", parent.At("ectopy"));
        if (r is null || !r.IsObject)
        {
            return null;
        }

        var e = new EctopySettings
        {
            PacPerHour = r.Number("pacPerHour", 0, 3600) ?? 0,
            PvcPerHour = r.Number("pvcPerHour", 0, 3600) ?? 0,
            PvcCoupletsPerHour = r.Number("pvcCoupletsPerHour", 0, 600) ?? 0,
            VeRunsPerHour = r.Number("veRunsPerHour", 0, 600) ?? 0,
            SveRunsPerHour = r.Number("sveRunsPerHour", 0, 600) ?? 0,
            RunBeatsMin = r.Integer("runBeatsMin", 3, 30) ?? 3,
            RunBeatsMax = r.Integer("runBeatsMax", 3, 30) ?? 6,
            SecondFocusFraction = r.Number("secondFocusFraction", 0, 1) ?? 0,
        };
        if (e.RunBeatsMax < e.RunBeatsMin)
        {
            r.Error("runBeatsMax", $"must not be below runBeatsMin ({e.RunBeatsMin})");
        }

        r.RejectUnknown();
        return e;
    }

    private static IReadOnlyList<SegmentEvent> ReadEvents(JsonObjectReader parent, double durationS)
    {
        var items = parent.Array("events");
        if (items is null)
        {
            return [];
        }

        var kinds = new Dictionary<string, SegmentEventKind>
        {
            ["pac"] = SegmentEventKind.Pac,
            ["pvc"] = SegmentEventKind.Pvc,
            ["pause"] = SegmentEventKind.Pause,
            ["blocked-p"] = SegmentEventKind.BlockedP,
        };
        var list = new List<SegmentEvent>();
        for (var i = 0; i < items.Count; i++)
        {
            var r = parent.Child(items[i], parent.At($"events[{i}]"));
            if (!r.IsObject)
            {
                continue;
            }

            var at = r.Number("atS", 0, durationS, required: true);
            var kindText = r.String("kind", required: true, allowed: kinds.Keys);
            var kind = kindText is null ? SegmentEventKind.Pac : kinds[kindText];
            var isBeat = kind is SegmentEventKind.Pac or SegmentEventKind.Pvc;
            var ev = new SegmentEvent
            {
                AtS = at ?? 0,
                Kind = kind,
                Count = isBeat ? r.Integer("count", 1, 30) ?? 1 : 1,
                RateBpm = isBeat ? r.Number("rateBpm", 80, 250) : null,
                DurationS = kind == SegmentEventKind.Pause ? r.Number("durationS", 1.5, 10) : null,
                Morphology = kind == SegmentEventKind.Pvc ? r.String("morphology", allowed: SegmentRules.VentricularShapes) : null,
                PShape = kind == SegmentEventKind.Pac ? r.String("pShape", allowed: SegmentRules.EctopicPShapes) : null,
            };
            r.RejectUnknown();
            if (at is not null && kindText is not null)
            {
                list.Add(ev);
            }
        }

        list.Sort((a, b) => a.AtS.CompareTo(b.AtS));
        return list;
    }
}
