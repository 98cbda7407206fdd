using LongRecord.Reporting.Drawing;
using SkiaSharp;
using static LongRecord.Reporting.Pages.ReportText;

namespace LongRecord.Reporting.Pages;

/// <summary>
/// The first page: who and what was recorded, the whole-recording figures in six groups, patient events with the
/// rhythm at each, the caution about automated findings and the reviewer's sign-off block.
/// </summary>
public sealed class OverviewPage : IReportSection
{
    /// <summary>The caution printed on every overview page.</summary>
    public const string Caution =
        "Automated analysis. These findings were produced by software and have not yet been reviewed. They support, and never " +
        "replace, review by qualified staff: every finding must be confirmed by a qualified physiologist or physician before it " +
        "informs care. LongRecord diagnoses nothing.";

    private const float BodyPt = 8.5f;
    private const float RowMm = 4.3f;

    public string Title => "Overview";

    public int PageCount(ReportContext context) => 1;

    public void DrawPage(ReportContext c, int page)
    {
        var p = c.P;
        var left = ReportContext.MarginMm;
        var y = ReportContext.BodyTopMm + 7;
        p.Text("Long-term ECG: automated analysis for review", left, y, 15, Ink.Text, bold: true);
        y += 4;
        y = Identity(c, y);
        y = Figures(c, y + 4);
        y = Symptoms(c, y + 3);
        CautionAndSignOff(c, y + 3);
    }

    private static float Identity(ReportContext c, float top)
    {
        var p = c.P;
        var m = c.Model;
        var half = c.BodyWidthMm / 2;
        var box = new SKRect(ReportContext.MarginMm, top, ReportContext.MarginMm + c.BodyWidthMm, top + 5 * RowMm + 3);
        p.Box(box, Ink.Panel);
        var patient = m.Patient.Deidentified
            ? new[] { ("Patient", $"de-identified: {m.Patient.Pseudonym}"), ("ID", "withheld"), ("Birth date", "withheld"), ("Sex", m.Patient.Sex ?? None) }
            : [("Patient", m.Patient.Name ?? "not recorded"), ("ID", m.Patient.Id ?? "not recorded"), ("Birth date", m.Patient.BirthDate ?? "not recorded"), ("Sex", m.Patient.Sex ?? "not recorded")];
        var r = m.Recording;
        var f = m.Figures;
        var recording = new[]
        {
            ("Recording", r.Name),
            ("Start", r.Start is null ? "not recorded (times are elapsed)" : Date(r.Start) + " (as recorded)"),
            ("Duration", Duration(r.DurationS)),
            ("Analysable", $"{Duration(f.AnalysableS)} ({Number(f.AnalysablePercent, 2, "%")})"),
            ("Leads", r.Leads.Count == 0 ? "none (beats from annotations)" : $"{string.Join(", ", r.Leads)} at {Number(r.ReferenceRateHz, 0, "Hz")}, {r.Format}"),
        };
        var y = top + 4.6f;
        for (var i = 0; i < 5; i++)
        {
            if (i < patient.Length)
            {
                Row(c, patient[i].Item1, patient[i].Item2, box.Left + 2, y, half - 4, 20);
            }

            Row(c, recording[i].Item1, recording[i].Item2, box.Left + half + 2, y, half - 4, 20);
            y += RowMm;
        }

        if (r.BeatSource != "detected")
        {
            p.Text(p.Fit($"Beats taken from {Path.GetFileName(r.BeatSource)}{(r.SignalAnalysed ? "" : ", no signal: no strips, widths or P waves")}", c.BodyWidthMm, 7.5f), box.Left, box.Bottom + 3.5f, 7.5f, Ink.Caution);
            return box.Bottom + 4;
        }

        return box.Bottom;
    }

    private static float Figures(ReportContext c, float top)
    {
        var m = c.Model;
        var f = m.Figures;
        var t = m.Thresholds;
        var rate = new List<(string, string)>
        {
            ("Total beats", Count(f.TotalBeats)),
            ("Mean rate", Number(f.HrMeanBpm, 1, "bpm")),
            ("Lowest (8-beat average)", Number(f.HrMinBpm, 1, "bpm")),
            ("    at", f.Slowest is { } s ? c.Moment(s.StartS) : None),
            ("Highest (8-beat average)", Number(f.HrMaxBpm, 1, "bpm")),
            ("    at", f.Fastest is { } q ? c.Moment(q.StartS) : None),
        };
        var af = new List<(string, string)>
        {
            ("AF burden", Number(f.AfBurdenPercent, 2, "%")),
            ($"AF episodes (≥ {Number(t.AfMinEpisodeS, 0)} s)", Count(f.AfEpisodeCount)),
            ("Longest AF", Duration(f.AfLongestS)),
            ("Brief AF-like stretches", Count(f.AfBriefCount)),
            ("AF at start / at end", $"{(f.AfAtStart ? "yes" : "no")} / {(f.AfAtEnd ? "yes" : "no")}"),
        };
        for (var d = 0; d < f.AfBurdenPerDayPercent.Count && f.AfBurdenPerDayPercent.Count > 1; d++)
        {
            af.Add(($"AF burden, day {d + 1}", Number(f.AfBurdenPerDayPercent[d], 2, "%")));
        }

        var pauses = new List<(string, string)>
        {
            ($"Pauses (RR ≥ {Number(t.PauseReportS, 1)} s)", Count(f.PauseCount)),
            ($"Pauses ≥ {Number(t.PauseHighlightS, 1)} s", Count(f.PauseHighlightedCount)),
            ("Longest pause", f.PauseLongestS is null ? None : Number(f.PauseLongestS, 2, "s")),
            ($"Bradycardia (< {Number(t.BradycardiaBpm, 0)} bpm, ≥ {Number(t.BradycardiaMinS, 0)} s)", Count(f.BradycardiaCount)),
        };
        var beats = f.BeatsByClass.Select(kv => (ClassWords(kv.Key), Count(kv.Value))).ToList();
        if (f.EctopicRuns is null)
        {
            beats.Add(("Couplets and runs", "not analysed"));
        }
        else
        {
            beats.AddRange(f.EctopicRuns.Select(kv => (kv.Key, Count(kv.Value))));
        }

        var hrv = new List<(string, string)>
        {
            ("SDNN", Number(f.SdnnMs, 1, "ms")),
            ("SDANN", Number(f.SdannMs, 1, "ms")),
            ("SDNN index", Number(f.SdnnIndexMs, 1, "ms")),
            ("RMSSD", Number(f.RmssdMs, 1, "ms")),
            ("pNN50", Number(f.Pnn50Percent, 2, "%")),
            ("HRV triangular index", Number(f.HrvTriangularIndex, 2)),
            ("LF / HF power", $"{Number(f.LfMs2, 1)} / {Number(f.HfMs2, 1)} ms²"),
            ("LF/HF ratio", Number(f.LfHfRatio, 3)),
            ("Left out of HRV", Duration(f.HrvExcludedS)),
        };
        // Kinds found, most first; the kinds with none are left out (summary.json lists every kind).
        var episodes = m.EpisodeCounts.Where(kv => kv.Value > 0).OrderByDescending(kv => kv.Value).Select(kv => (Kind(kv.Key), Count(kv.Value))).ToList();
        if (episodes.Count == 0)
        {
            episodes.Add(("Episodes", "none found"));
        }

        episodes.Add(("Flagged for review", Count(m.FlaggedEpisodeCount ?? m.Episodes.Count(e => e.Flagged))));
        var col = c.BodyWidthMm / 3;
        var row1 = Math.Max(rate.Count, Math.Max(af.Count, pauses.Count));
        Group(c, "Heart rate", rate, ReportContext.MarginMm, top, col - 3);
        Group(c, "Atrial fibrillation", af, ReportContext.MarginMm + col, top, col - 3);
        Group(c, "Pauses and slow rates", pauses, ReportContext.MarginMm + 2 * col, top, col - 3);
        var top2 = top + 6 + row1 * RowMm + 3;
        var row2 = Math.Max(beats.Count, Math.Max(hrv.Count, episodes.Count));
        Group(c, "Beats by class (EC57)", beats, ReportContext.MarginMm, top2, col - 3);
        Group(c, "Heart-rate variability (NN)", hrv, ReportContext.MarginMm + col, top2, col - 3);
        Group(c, "Episodes by kind", episodes, ReportContext.MarginMm + 2 * col, top2, col - 3);
        return top2 + 6 + row2 * RowMm;
    }

    private static float Symptoms(ReportContext c, float top)
    {
        var p = c.P;
        var left = ReportContext.MarginMm;
        p.Text("Patient events and the rhythm found at each", left, top + 3.5f, 9.5f, Ink.Accent, bold: true);
        p.Line(left, top + 5, left + c.BodyWidthMm, top + 5, Ink.Rule);
        var y = top + 9;
        var list = c.Model.Symptoms;
        if (list.Count == 0)
        {
            p.Text("No patient events (diary entries or button presses) in the recording.", left, y, BodyPt, Ink.Muted);
            return y + 2;
        }

        float[] cols = [left, left + 24, left + 100, left + 160];
        p.Text("time", cols[0], y, 7.5f, Ink.Muted);
        p.Text("event as recorded", cols[1], y, 7.5f, Ink.Muted);
        p.Text("rhythm found", cols[2], y, 7.5f, Ink.Muted);
        p.Text("rate", cols[3], y, 7.5f, Ink.Muted);
        y += RowMm;
        const int maxRows = 8;
        foreach (var s in list.Take(maxRows))
        {
            p.Text(c.Moment(s.TimeS), cols[0], y, BodyPt, Ink.Text);
            p.Text(p.Fit(s.Text, 74, BodyPt), cols[1], y, BodyPt, Ink.Text);
            p.Text(p.Fit(s.Rhythm, 58, BodyPt), cols[2], y, BodyPt, Ink.Text);
            p.Text(Number(s.RateBpm, 0, "bpm"), cols[3], y, BodyPt, Ink.Text);
            y += RowMm;
        }

        if (list.Count > maxRows)
        {
            p.Text($"… and {list.Count - maxRows} more events in the recording.", cols[1], y, BodyPt, Ink.Muted);
            y += RowMm;
        }

        return y - RowMm + 2;
    }

    private static void CautionAndSignOff(ReportContext c, float top)
    {
        var p = c.P;
        var left = ReportContext.MarginMm;
        var right = left + c.BodyWidthMm;
        var lines = p.Wrap(Caution, c.BodyWidthMm - 6, 8, bold: true);
        var box = new SKRect(left, top, right, top + 3 + lines.Count * 3.6f + 1.5f);
        p.Box(box, Ink.CautionPanel);
        p.Line(left, top, left, box.Bottom, Ink.Caution, 0.8f);
        var y = top + 4.2f;
        foreach (var l in lines)
        {
            p.Text(l, left + 3, y, 8, Ink.Text, bold: l == lines[0]);
            y += 3.6f;
        }

        // Sign-off: filled in by hand (or by the reviewing system) after review.
        var s = box.Bottom + 5;
        var bottom = c.BodyBottomMm;
        p.Text("Review and sign-off", left, s + 3.5f, 9.5f, Ink.Accent, bold: true);
        p.Line(left, s + 5, right, s + 5, Ink.Rule);
        var y1 = s + 13;
        p.Text("Reviewed by", left, y1, BodyPt, Ink.Muted);
        p.Line(left + 22, y1 + 0.8f, left + 100, y1 + 0.8f, Ink.Muted, 0.15f);
        p.Text("Date", left + 108, y1, BodyPt, Ink.Muted);
        p.Line(left + 118, y1 + 0.8f, right, y1 + 0.8f, Ink.Muted, 0.15f);
        var y2 = y1 + 8;
        p.Text("Conclusion", left, y2, BodyPt, Ink.Muted);
        for (var ly = y2; ly + 0.8f <= bottom - 1; ly += 7)
        {
            p.Line(left + 22, ly + 0.8f, right, ly + 0.8f, Ink.Muted, 0.15f);
        }
    }

    private static void Group(ReportContext c, string title, IReadOnlyList<(string Label, string Value)> rows, float x, float top, float width)
    {
        var p = c.P;
        p.Text(p.Fit(title, width, 9.5f, bold: true), x, top + 3.5f, 9.5f, Ink.Accent, bold: true);
        p.Line(x, top + 5, x + width, top + 5, Ink.Rule);
        var y = top + 9;
        foreach (var (label, value) in rows)
        {
            var valueWidth = p.Measure(value, BodyPt, bold: true);
            p.Text(p.Fit(label, width - valueWidth - 2, BodyPt), x, y, BodyPt, Ink.Muted);
            p.Text(value, x + width, y, BodyPt, Ink.Text, bold: true, align: SKTextAlign.Right);
            y += RowMm;
        }
    }

    private static void Row(ReportContext c, string label, string value, float x, float y, float width, float labelWidth)
    {
        c.P.Text(label, x, y, BodyPt, Ink.Muted);
        c.P.Text(c.P.Fit(value, width - labelWidth, BodyPt, bold: true), x + labelWidth, y, BodyPt, Ink.Text, bold: true);
    }

    private static string ClassWords(string letter) => letter switch
    {
        "N" => "N  normal or not ectopic",
        "S" => "S  supraventricular (SVE)",
        "V" => "V  ventricular (VE)",
        "F" => "F  fusion",
        "Q" => "Q  unclassifiable",
        _ => letter,
    };
}
