using System.Text.Json;

namespace LongRecord.Synthesis.Scenarios;

/// <summary>Reads one noise stretch of the scenario.</summary>
internal static class NoiseReader
{
    private static readonly Dictionary<string, NoiseKind> s_kinds = new()
    {
        ["baseline-wander"] = NoiseKind.BaselineWander,
        ["muscle"] = NoiseKind.Muscle,
        ["electrode-motion"] = NoiseKind.ElectrodeMotion,
        ["lead-off"] = NoiseKind.LeadOff,
    };

    private static readonly Dictionary<string, LeadOffMode> s_modes = new()
    {
        ["flat"] = LeadOffMode.Flat,
        ["rail-high"] = LeadOffMode.RailHigh,
        ["rail-low"] = LeadOffMode.RailLow,
    };

    public static string Name(NoiseKind kind) => s_kinds.First(p => p.Value == kind).Key;

    public static string Name(LeadOffMode mode) => s_modes.First(p => p.Value == mode).Key;

    public static NoiseStretch? Read(JsonElement element, int index, List<string> errors, IReadOnlyList<ScenarioLead> leads, double timelineS)
    {
        var r = new JsonObjectReader(element, $"noise[{index}]", errors);
        if (!r.IsObject)
        {
            return null;
        }

        var kindText = r.String("kind", required: true, allowed: s_kinds.Keys);
        var start = r.Number("startS", 0, 14 * 86400.0, required: true);
        var duration = r.Number("durationS", 0.5, 14 * 86400.0, required: true);
        var kind = kindText is null ? NoiseKind.Muscle : s_kinds[kindText];
        double? snr = null;
        var mode = LeadOffMode.Flat;
        var rail = 5.0;
        if (kind == NoiseKind.LeadOff)
        {
            if (r.Has("snrDb"))
            {
                r.Error("snrDb", "does not apply to lead-off");
                r.Raw("snrDb");
            }

            var modeText = r.String("mode", allowed: s_modes.Keys);
            mode = modeText is null ? LeadOffMode.Flat : s_modes[modeText];
            rail = r.Number("railMv", 0.5, 50) ?? 5.0;
        }
        else
        {
            snr = r.Number("snrDb", -20, 60, required: true);
            foreach (var f in new[] { "mode", "railMv" })
            {
                if (r.Has(f))
                {
                    r.Error(f, "applies to lead-off only");
                    r.Raw(f);
                }
            }
        }

        var labels = new List<string>();
        foreach (var item in r.Array("leads") ?? [])
        {
            if (item.ValueKind != JsonValueKind.String)
            {
                r.Error("leads", "must list lead labels as strings");
                continue;
            }

            var label = item.GetString()!;
            if (!leads.Any(l => l.Label == label))
            {
                r.Error("leads", $"names lead '{label}', which the scenario does not declare");
            }
            else if (!labels.Contains(label))
            {
                labels.Add(label);
            }
        }

        if (start is double s && duration is double d && timelineS > 0 && s + d > timelineS + 1e-9)
        {
            r.Error("durationS", $"the stretch ends at {JsonObjectReader.F(s + d)} s, after the timeline's {JsonObjectReader.F(timelineS)} s");
        }

        r.RejectUnknown();
        if (kindText is null || start is null || duration is null || (kind != NoiseKind.LeadOff && snr is null))
        {
            return null;
        }

        return new NoiseStretch
        {
            Kind = kind,
            StartS = start.Value,
            DurationS = duration.Value,
            SnrDb = snr,
            Leads = labels,
            Mode = mode,
            RailMv = rail,
        };
    }
}
