namespace LongRecord.Analysis.Quality;

/// <summary>Consecutive windows with the same verdict: one row of <c>quality.csv</c> (<c>start_s,end_s,analysable,reason</c>).</summary>
public readonly record struct QualityStretch(long StartSample, long EndSample, double StartS, double EndS, bool Analysable, QualityReason Reason)
{
    public double DurationS => EndS - StartS;
}

/// <summary>Consecutive windows in which one lead had the same state.</summary>
public readonly record struct LeadStretch(int Lead, long StartSample, long EndSample, double StartS, double EndS, LeadState State)
{
    public double DurationS => EndS - StartS;
}

/// <summary>Merges windows into stretches and sums analysable time.</summary>
public static class QualityStretches
{
    /// <summary>Merges consecutive windows (in order, touching) with the same verdict.</summary>
    public static List<QualityStretch> Merge(IEnumerable<QualityWindow> windows)
    {
        var list = new List<QualityStretch>();
        foreach (var w in windows)
        {
            Append(list, w);
        }

        return list;
    }

    /// <summary>Merges consecutive windows in which lead <paramref name="lead"/> had the same state.</summary>
    public static List<LeadStretch> MergeLead(IEnumerable<QualityWindow> windows, int lead)
    {
        var list = new List<LeadStretch>();
        foreach (var w in windows)
        {
            AppendLead(list, w, lead);
        }

        return list;
    }

    /// <summary>Adds <paramref name="window"/> to <paramref name="stretches"/>, extending the last stretch when the verdict is the same.</summary>
    public static void Append(List<QualityStretch> stretches, in QualityWindow window)
    {
        if (stretches.Count > 0)
        {
            var last = stretches[^1];
            if (last.EndSample == window.StartSample && last.Reason == window.Reason)
            {
                stretches[^1] = last with { EndSample = window.EndSample, EndS = window.EndS };
                return;
            }
        }

        stretches.Add(new QualityStretch(window.StartSample, window.EndSample, window.StartS, window.EndS, window.Analysable, window.Reason));
    }

    /// <summary>Adds lead <paramref name="lead"/> of <paramref name="window"/> to <paramref name="stretches"/>.</summary>
    public static void AppendLead(List<LeadStretch> stretches, in QualityWindow window, int lead)
    {
        var state = window.State(lead);
        if (stretches.Count > 0)
        {
            var last = stretches[^1];
            if (last.EndSample == window.StartSample && last.State == state)
            {
                stretches[^1] = last with { EndSample = window.EndSample, EndS = window.EndS };
                return;
            }
        }

        stretches.Add(new LeadStretch(lead, window.StartSample, window.EndSample, window.StartS, window.EndS, state));
    }

    /// <summary>
    /// Analysable seconds in each clock hour from the start of the recording (hour h covers [3600 h, 3600 (h + 1)) s;
    /// the last entry may cover a shorter hour).
    /// </summary>
    public static double[] AnalysableSecondsPerHour(IReadOnlyList<QualityStretch> stretches)
    {
        if (stretches.Count == 0)
        {
            return [];
        }

        var hours = (int)Math.Ceiling(stretches[^1].EndS / 3600.0);
        var result = new double[Math.Max(1, hours)];
        foreach (var s in stretches)
        {
            if (!s.Analysable)
            {
                continue;
            }

            for (var h = (int)(s.StartS / 3600.0); h < result.Length && h * 3600.0 < s.EndS; h++)
            {
                var from = Math.Max(s.StartS, h * 3600.0);
                var to = Math.Min(s.EndS, (h + 1) * 3600.0);
                result[h] += Math.Max(0, to - from);
            }
        }

        return result;
    }
}
