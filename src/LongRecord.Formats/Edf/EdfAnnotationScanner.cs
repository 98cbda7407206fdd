using System.Runtime.CompilerServices;
using LongRecord.Formats.IO;

namespace LongRecord.Formats.Edf;

/// <summary>What the annotation signals of a file say: its events, and where each data record lies in time.</summary>
internal sealed class EdfAnnotationScan
{
    /// <summary>Events with onsets in elapsed seconds from the first sample, in onset order (file order for equal onsets).</summary>
    public required IReadOnlyList<RecordingEvent> Events { get; init; }

    public required EdfTimeline Timeline { get; init; }

    /// <summary>Onset of the first data record after the header's start time (the EDF+ sub-second start), seconds.</summary>
    public required double FirstRecordOnsetS { get; init; }
}

/// <summary>Reads the annotation signal(s) of every data record once, when a file is opened.</summary>
internal static class EdfAnnotationScanner
{
    // Bytes read per call while scanning (common practice, no source: large enough to amortise a system call).
    private const int ChunkBytes = 1 << 20;

    // One long loop over every data record: optimised from the start rather than waiting on the start-up tier.
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static EdfAnnotationScan Scan(ReadOnlyRecordingFile file, EdfHeader h, int records)
    {
        var annotations = h.Signals.Where(s => s.IsAnnotation).ToArray();
        var d = h.RecordDurationS;
        if (annotations.Length == 0 || records == 0)
        {
            EdfSegment[] whole = records == 0 ? [] : [new EdfSegment(0, records, 0)];
            return new EdfAnnotationScan { Events = [], Timeline = new EdfTimeline(whole, d), FirstRecordOnsetS = 0 };
        }

        var bps = h.BytesPerSample;
        var spanStart = annotations.Min(s => s.OffsetInRecord);
        var spanEnd = annotations.Max(s => s.OffsetInRecord + s.SamplesPerRecord * bps);
        var spanBytes = spanEnd - spanStart;

        // Read whole records when the annotations are a fair part of them; otherwise only the annotation bytes.
        var readWhole = spanBytes * 8L >= h.RecordBytes || h.RecordBytes <= 8192;
        var unit = readWhole ? h.RecordBytes : spanBytes;
        var chunk = Math.Clamp(ChunkBytes / unit, 1, records);
        var buffer = new byte[chunk * unit];

        var maxRateHz = h.Signals.Where(s => !s.IsAnnotation).Select(s => s.SamplesPerRecord / d).DefaultIfEmpty(0).Max();
        // Records closer than half the fastest channel's sample period count as back to back.
        var toleranceS = maxRateHz > 0 ? 0.5 / maxRateHz : 1e-6;

        var events = new List<RecordingEvent>();
        var segments = new List<EdfSegment>();
        var onset0 = 0.0;
        int segFirst = 0;
        var segOnset = 0.0;

        for (var r0 = 0; r0 < records; r0 += chunk)
        {
            var n = Math.Min(chunk, records - r0);
            var chunkOffset = h.HeaderBytes + (long)r0 * h.RecordBytes;
            if (readWhole)
            {
                file.ReadExactly(chunkOffset, buffer.AsSpan(0, n * unit), $"data records {r0 + 1}–{r0 + n}");
            }
            else
            {
                for (var k = 0; k < n; k++)
                {
                    file.ReadExactly(chunkOffset + (long)k * h.RecordBytes + spanStart, buffer.AsSpan(k * unit, unit), $"data record {r0 + k + 1}");
                }
            }

            for (var k = 0; k < n; k++)
            {
                var r = r0 + k;
                var recordOffset = h.HeaderBytes + (long)r * h.RecordBytes;
                double? timeKeeping = null;
                for (var a = 0; a < annotations.Length; a++)
                {
                    var s = annotations[a];
                    var at = k * unit + s.OffsetInRecord - (readWhole ? 0 : spanStart);
                    var region = buffer.AsSpan(at, s.SamplesPerRecord * bps);
                    var t = EdfTalParser.Parse(region, timeKeeping: a == 0, events, file.Path, recordOffset + s.OffsetInRecord, r);
                    if (a == 0)
                    {
                        timeKeeping = t;
                    }
                }

                var tkOffset = recordOffset + annotations[0].OffsetInRecord;
                if (h.Variant == EdfVariant.Discontinuous && timeKeeping is null)
                {
                    RecordingFormatException.Throw(file.Path,
                        $"data record {r + 1} of an EDF+D file has no time-keeping TAL (its annotation signal must begin '+onset' 0x14 0x14)",
                        tkOffset, "EDF Annotations");
                }

                if (r == 0)
                {
                    onset0 = timeKeeping ?? 0;
                    continue;
                }

                if (timeKeeping is not double tk || d == 0)
                {
                    continue;
                }

                if (h.Variant == EdfVariant.Discontinuous)
                {
                    var e = tk - onset0;
                    var previousEnd = segOnset + (r - segFirst) * d;
                    if (e < previousEnd - toleranceS)
                    {
                        RecordingFormatException.Throw(file.Path,
                            $"data record {r + 1} starts at +{tk.ToInvariant()} s, before data record {r} ends (+{(previousEnd + onset0).ToInvariant()} s): EDF+D records must be in time order without overlap",
                            tkOffset, "EDF Annotations");
                    }

                    if (e > previousEnd + toleranceS)
                    {
                        segments.Add(new EdfSegment(segFirst, r - segFirst, segOnset));
                        segFirst = r;
                        segOnset = e;
                    }
                }
                else
                {
                    // EDF+C promises contiguous records. Small drift in written onsets is tolerated; a record more than half a
                    // record away from its place means the file is really discontinuous, and reading it as EDF+C would
                    // misplace every later sample and event, so it is refused.
                    var expected = onset0 + r * d;
                    if (Math.Abs(tk - expected) > d / 2)
                    {
                        RecordingFormatException.Throw(file.Path,
                            $"data record {r + 1} of an {h.FormatDetail} file starts at +{tk.ToInvariant()} s by its time-keeping TAL, but contiguous records put it at +{expected.ToInvariant()} s",
                            tkOffset, "EDF Annotations");
                    }
                }
            }
        }

        segments.Add(new EdfSegment(segFirst, records - segFirst, segOnset));
        var shifted = events.Select(e => e with { OnsetS = e.OnsetS - onset0 }).OrderBy(e => e.OnsetS).ToArray();
        return new EdfAnnotationScan { Events = shifted, Timeline = new EdfTimeline([.. segments], d), FirstRecordOnsetS = onset0 };
    }
}
