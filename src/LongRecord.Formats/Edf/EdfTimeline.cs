namespace LongRecord.Formats.Edf;

/// <summary>A run of back-to-back data records whose first sample lies <paramref name="OnsetS"/> seconds after the file's first sample.</summary>
internal readonly record struct EdfSegment(int FirstRecord, int RecordCount, double OnsetS);

/// <summary>
/// Maps sample positions on the elapsed-time axis to data records. A contiguous file is one segment; an EDF+D file has a
/// segment per run of contiguous records, so memory grows with the number of gaps, not with the number of records.
/// A segment's first sample sits at round(onset × rate) on each channel's axis; positions between segments are gaps.
/// </summary>
internal sealed class EdfTimeline(EdfSegment[] segments, double recordDurationS)
{
    public int SegmentCount => segments.Length;

    public EdfSegment this[int segment] => segments[segment];

    public long SegmentStart(int segment, int samplesPerRecord) =>
        segment == 0 ? 0 : (long)Math.Round(segments[segment].OnsetS / recordDurationS * samplesPerRecord);

    public long SegmentEnd(int segment, int samplesPerRecord) =>
        SegmentStart(segment, samplesPerRecord) + (long)segments[segment].RecordCount * samplesPerRecord;

    public long SampleCount(int samplesPerRecord) => segments.Length == 0 ? 0 : SegmentEnd(segments.Length - 1, samplesPerRecord);

    /// <summary>The last segment starting at or before <paramref name="position"/>.</summary>
    public int FindSegment(long position, int samplesPerRecord)
    {
        int lo = 0, hi = segments.Length - 1;
        while (lo < hi)
        {
            var mid = (lo + hi + 1) >> 1;
            if (SegmentStart(mid, samplesPerRecord) <= position)
            {
                lo = mid;
            }
            else
            {
                hi = mid - 1;
            }
        }

        return lo;
    }

    /// <summary>Elapsed seconds from the first sample to the end of the last data record.</summary>
    public double DurationS => segments.Length == 0 ? 0 : segments[^1].OnsetS + segments[^1].RecordCount * recordDurationS;

    public IReadOnlyList<RecordingGap> Gaps()
    {
        var gaps = new List<RecordingGap>();
        for (var s = 1; s < segments.Length; s++)
        {
            var start = segments[s - 1].OnsetS + segments[s - 1].RecordCount * recordDurationS;
            gaps.Add(new RecordingGap(start, segments[s].OnsetS - start));
        }

        return gaps;
    }
}
