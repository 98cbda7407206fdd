using System.Globalization;
using System.Text.Json;
using LongRecord.Synthesis.Model;

namespace LongRecord.Synthesis.Scenarios;

/// <summary>Turns a parsed scenario document into a <see cref="Scenario"/>, collecting every problem.</summary>
internal static class ScenarioReader
{
    public static Scenario? Read(JsonElement root, List<string> errors)
    {
        var r = new JsonObjectReader(root, "", errors);
        if (!r.IsObject)
        {
            return null;
        }

        var name = r.String("name", required: true);
        var description = r.String("description") ?? "";
        var start = ReadDateTime(r, "startDateTime");
        var rate = r.Number("samplingRateHz", 100, 1000) ?? 250;
        var seed = r.Number("seed", 0, 9007199254740991);
        if (seed is double s && s != Math.Floor(s))
        {
            r.Error("seed", "must be a whole number");
        }

        var hours = r.Number("hours", 0.001, 24 * 14);
        var patient = ReadPatient(r.Object("patient", "patient"));
        var recording = ReadRecording(r.Object("recording", "recording"));
        var leads = ReadLeads(r);
        var circadian = ReadCircadian(r.Object("circadian", "circadian"));
        var background = ReadBackground(r.Object("background", "background"));
        var segments = ReadSegments(r, errors);
        var timeline = segments.Sum(x => x.DurationS);
        var noise = ReadNoise(r, errors, leads, timeline);
        var diary = ReadDiary(r, timeline);
        r.RejectUnknown();

        if (name is null || start is null)
        {
            return null;
        }

        return new Scenario
        {
            Name = name,
            Description = description,
            StartDateTime = start.Value,
            SamplingRateHz = rate,
            Seed = seed is double sd ? (ulong)sd : 1,
            Hours = hours,
            Patient = patient,
            Recording = recording,
            Leads = leads,
            Circadian = circadian,
            Background = background,
            Segments = segments,
            Noise = noise,
            Diary = diary,
        };
    }

    private static IReadOnlyList<DiaryEntry> ReadDiary(JsonObjectReader r, double timelineS)
    {
        var items = r.Array("diary");
        if (items is null)
        {
            return [];
        }

        var entries = new List<DiaryEntry>();
        for (var i = 0; i < items.Count; i++)
        {
            var er = r.Child(items[i], $"diary[{i}]");
            var at = er.Number("atS", 0, Math.Max(0, timelineS), required: true);
            var text = er.String("text", required: true);
            er.RejectUnknown();
            if (at is double a && text is not null)
            {
                entries.Add(new DiaryEntry(a, text));
            }
        }

        return entries.OrderBy(e => e.AtS).ToArray();
    }

    private static DateTime? ReadDateTime(JsonObjectReader r, string field)
    {
        var text = r.String(field, required: true);
        if (text is null)
        {
            return null;
        }

        if (!DateTime.TryParseExact(text, ["yyyy-MM-ddTHH:mm:ss", "yyyy-MM-ddTHH:mm"], CultureInfo.InvariantCulture, DateTimeStyles.None, out var dt))
        {
            r.Error(field, $"must be a local date-time like 2026-03-02T09:40:00 (is '{text}')");
            return null;
        }

        return dt;
    }

    private static ScenarioPatient ReadPatient(JsonObjectReader? r)
    {
        if (r is null || !r.IsObject)
        {
            return new ScenarioPatient();
        }

        var p = new ScenarioPatient
        {
            Name = r.String("name") ?? "Synthetic Patient",
            Id = r.String("id") ?? "SYN-0000",
            Sex = r.String("sex", allowed: ["F", "M", "X"]) ?? "X",
        };
        var birth = r.String("birthDate");
        if (birth is not null)
        {
            if (DateOnly.TryParseExact(birth, "yyyy-MM-dd", CultureInfo.InvariantCulture, DateTimeStyles.None, out var d))
            {
                p = p with { BirthDate = d };
            }
            else
            {
                r.Error("birthDate", $"must be a date like 1958-07-14 (is '{birth}')");
            }
        }

        r.RejectUnknown();
        return p;
    }

    private static ScenarioRecordingInfo ReadRecording(JsonObjectReader? r)
    {
        if (r is null || !r.IsObject)
        {
            return new ScenarioRecordingInfo();
        }

        var info = new ScenarioRecordingInfo
        {
            Id = r.String("id") ?? "SYN-REC-0000",
            Clinic = r.String("clinic") ?? "",
            Device = r.String("device") ?? "LongRecord synthesiser",
            Technician = r.String("technician") ?? "",
        };
        r.RejectUnknown();
        return info;
    }

    private static IReadOnlyList<ScenarioLead> ReadLeads(JsonObjectReader r)
    {
        var items = r.Array("leads");
        if (items is null)
        {
            return new Scenario { Name = "", StartDateTime = default, Segments = [] }.Leads;
        }

        if (items.Count is < 1 or > 3)
        {
            r.Error("leads", $"must list 1 to 3 leads (lists {items.Count})");
        }

        var leads = new List<ScenarioLead>();
        for (var i = 0; i < items.Count; i++)
        {
            var lr = r.Child(items[i], $"leads[{i}]");
            var label = lr.String("label", required: true);
            var viewText = lr.String("view", required: true, allowed: Enum.GetNames<LeadView>());
            lr.RejectUnknown();

            if (label is not null && leads.Any(l => l.Label == label))
            {
                r.Error($"leads[{i}].label", $"'{label}' is used twice");
            }

            if (label is not null && viewText is not null && ScenarioLoader.TryParseView(viewText, out var view))
            {
                leads.Add(new ScenarioLead(label, view));
            }
        }

        return leads;
    }

    private static CircadianSettings ReadCircadian(JsonObjectReader? r)
    {
        if (r is null || !r.IsObject)
        {
            return new CircadianSettings();
        }

        var c = new CircadianSettings
        {
            DayRateBpm = r.Number("dayRateBpm", 40, 150) ?? 75,
            NightRateBpm = r.Number("nightRateBpm", 35, 150) ?? 55,
        };
        foreach (var field in new[] { "wakeTime", "sleepTime" })
        {
            var text = r.String(field);
            if (text is null)
            {
                continue;
            }

            if (!ScenarioLoader.TryParseTime(text, out var t))
            {
                r.Error(field, $"must be a clock time like 06:30 (is '{text}')");
            }
            else
            {
                c = field == "wakeTime" ? c with { WakeTime = t } : c with { SleepTime = t };
            }
        }

        r.RejectUnknown();
        return c;
    }

    private static BackgroundNoise ReadBackground(JsonObjectReader? r)
    {
        if (r is null || !r.IsObject)
        {
            return new BackgroundNoise();
        }

        var b = new BackgroundNoise
        {
            BaselineWanderMv = r.Number("baselineWanderMv", 0, 1) ?? 0.04,
            MuscleNoiseMv = r.Number("muscleNoiseMv", 0, 1) ?? 0.005,
        };
        r.RejectUnknown();
        return b;
    }

    private static IReadOnlyList<ScenarioSegment> ReadSegments(JsonObjectReader r, List<string> errors)
    {
        var items = r.Array("segments", required: true);
        if (items is null)
        {
            return [];
        }

        if (items.Count == 0)
        {
            r.Error("segments", "must list at least one segment");
        }

        var list = new List<ScenarioSegment>();
        for (var i = 0; i < items.Count; i++)
        {
            if (SegmentReader.Read(items[i], i, errors) is ScenarioSegment seg)
            {
                list.Add(seg);
            }
        }

        return list;
    }

    private static IReadOnlyList<NoiseStretch> ReadNoise(JsonObjectReader r, List<string> errors, IReadOnlyList<ScenarioLead> leads, double timelineS)
    {
        var items = r.Array("noise");
        if (items is null)
        {
            return [];
        }

        var list = new List<NoiseStretch>();
        for (var i = 0; i < items.Count; i++)
        {
            if (NoiseReader.Read(items[i], i, errors, leads, timelineS) is NoiseStretch n)
            {
                list.Add(n);
            }
        }

        return list;
    }
}
