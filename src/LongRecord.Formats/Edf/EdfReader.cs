using LongRecord.Formats.IO;

namespace LongRecord.Formats.Edf;

/// <summary>
/// Reads EDF, EDF+ (EDF+C and EDF+D) and BDF/BDF+ files (Kemp et al. 1992; Kemp and Olivan 2003; BioSemi's 24-bit variant).
/// The header and every annotation signal are read and checked when the file is opened; samples are read on demand
/// through a fixed buffer of whole data records, so memory does not depend on recording length.
/// </summary>
/// <remarks>
/// <para>Time axis: elapsed time 0 is the first sample of the first data record. EDF+ onsets count from the header's start
/// time, whose resolution is one second; the first record's time-keeping TAL (for example "+0.123") gives the sub-second
/// start. <see cref="RecordingInfo.StartTime"/> is the header time plus that offset, and event onsets are the TAL onsets
/// minus it, so header start + TAL onset and StartDateTime + <see cref="RecordingEvent.OnsetS"/> name the same instant.</para>
/// <para>EDF+D: each run of back-to-back records is a segment placed at its time-keeping onset; positions between segments
/// read as NaN and are listed in <see cref="RecordingInfo.Gaps"/>. Only the segments are kept (memory grows with the
/// number of gaps). A record whose onset is off the sample grid starts at the nearest sample position.</para>
/// <para>EDF+C: time-keeping onsets are checked; a record more than half a record from its contiguous place is an error.
/// A record without a time-keeping TAL (some writers put it in the first record only) is accepted as contiguous.</para>
/// <para>Number of data records −1 (unknown, written while recording): the count is taken from the file size, which must
/// then hold whole records only. Bytes after the declared records are ignored.</para>
/// <para>Data record duration 0 (an annotation-only file): no channel, <see cref="RecordingInfo.HasSignal"/> false, and
/// <see cref="RecordingInfo.DurationS"/> is the end of the latest annotation (onset + duration).</para>
/// <para>Signals and data records are numbered from 1 in messages, as they are counted in the header.</para>
/// </remarks>
public sealed class EdfReader : RecordingReader
{
    // One positioned read fetches this many bytes of whole records (common practice, no source: big enough that a
    // system call costs little against decoding, small enough to stay in cache).
    private const int ChunkBytes = 1 << 20;

    private readonly ReadOnlyRecordingFile _file;
    private readonly EdfHeader _header;
    private readonly EdfTimeline _timeline;
    private readonly EdfSignalHeader[] _channelSignals;
    private readonly float[] _scale;
    private readonly float[] _offset;
    private readonly int _records;
    private readonly int _chunkRecords;
    private byte[]? _buffer;
    private int _cacheFirst;
    private int _cacheCount;

    private EdfReader(ReadOnlyRecordingFile file, EdfHeader header, int records, EdfAnnotationScan scan)
    {
        _file = file;
        _header = header;
        _records = records;
        _timeline = scan.Timeline;
        _channelSignals = header.Signals.Where(s => !s.IsAnnotation).ToArray();
        _chunkRecords = Math.Clamp(ChunkBytes / header.RecordBytes, 1, Math.Max(1, records));
        _scale = new float[_channelSignals.Length];
        _offset = new float[_channelSignals.Length];

        var channels = new ChannelInfo[_channelSignals.Length];
        for (var c = 0; c < channels.Length; c++)
        {
            var s = _channelSignals[c];
            var info = new ChannelInfo
            {
                Label = s.Label,
                PhysicalUnit = s.PhysicalUnit,
                SamplingRateHz = s.SamplesPerRecord / header.RecordDurationS,
                SampleCount = _timeline.SampleCount(s.SamplesPerRecord),
                Gain = s.Gain,
                Baseline = s.Baseline,
                DigitalMin = s.DigitalMin,
                DigitalMax = s.DigitalMax,
                Transducer = s.Transducer,
                Prefilter = s.Prefilter,
            };
            // physical = physMin + (digital − digMin) × (physMax − physMin) / (digMax − digMin), then to mV.
            var toReturned = info.IsVoltage ? info.MillivoltsPerUnit : 1.0;
            var perDigit = (s.PhysicalMax - s.PhysicalMin) / ((double)s.DigitalMax - s.DigitalMin);
            _scale[c] = (float)(perDigit * toReturned);
            _offset[c] = (float)((s.PhysicalMin - s.DigitalMin * perDigit) * toReturned);
            channels[c] = info;
        }

        DateOnly? date = header.StartDate;
        TimeOnly? time = header.StartTime;
        if (date is DateOnly d && scan.FirstRecordOnsetS != 0)
        {
            var start = d.ToDateTime(header.StartTime).AddTicks((long)Math.Round(scan.FirstRecordOnsetS * TimeSpan.TicksPerSecond));
            date = DateOnly.FromDateTime(start);
            time = TimeOnly.FromDateTime(start);
        }

        var hasSignal = channels.Length > 0;
        Info = new RecordingInfo
        {
            FilePath = file.Path,
            Format = header.IsBdf ? RecordingFormat.Bdf : RecordingFormat.Edf,
            FormatDetail = header.FormatDetail,
            Channels = channels,
            StartDate = date,
            StartTime = time,
            DurationS = header.RecordDurationS > 0
                ? _timeline.DurationS
                : scan.Events.Select(e => e.OnsetS + (e.DurationS ?? 0)).DefaultIfEmpty(0).Max(),
            Identification = EdfIdentificationParser.Parse(header.PatientField, header.RecordingField, header.IsPlus),
            Gaps = _timeline.Gaps(),
            Events = scan.Events,
            HasSignal = hasSignal,
            NoSignalReason = hasSignal ? null
                : header.RecordDurationS == 0 ? "annotation-only file (data record duration 0)"
                : "the file holds only annotation signals",
        };
    }

    public override RecordingInfo Info { get; }

    /// <summary>Opens <paramref name="path"/> read-only and checks its header and annotations.</summary>
    /// <exception cref="RecordingFormatException">The file is missing, unreadable or not a valid EDF/EDF+/BDF file.</exception>
    public static EdfReader Open(string path)
    {
        var file = ReadOnlyRecordingFile.Open(path);
        try
        {
            var header = EdfHeaderParser.Parse(file);
            var records = CountRecords(file, header);
            var scan = EdfAnnotationScanner.Scan(file, header, records);
            return new EdfReader(file, header, records, scan);
        }
        catch
        {
            file.Dispose();
            throw;
        }
    }

    /// <summary>
    /// True when <paramref name="head"/> (the first bytes of a file, any length) starts like an EDF or BDF header: the
    /// version field ("0" and spaces, or 0xFF and seven printable characters, so a BDF with a damaged "BIOSEMI" still
    /// reaches this reader and its specific message) and, where present, digits in the start date and time fields.
    /// </summary>
    public static bool Sniff(ReadOnlySpan<byte> head)
    {
        if (head.Length < 8)
        {
            return false;
        }

        var edf = head[0] == (byte)'0' && head[1..8].IndexOfAnyExcept((byte)' ') < 0;
        var bdf = head[0] == 0xFF && head[1..8].IndexOfAnyExceptInRange((byte)' ', (byte)'~') < 0;
        if (!edf && !bdf)
        {
            return false;
        }

        // dd.mm.yy and hh.mm.ss: the year may be the literal "yy" (EDF+ after 2084), so it is not checked.
        foreach (var at in (ReadOnlySpan<int>)[168, 169, 171, 172, 176, 177, 179, 180, 182, 183])
        {
            if (at < head.Length && !char.IsAsciiDigit((char)head[at]))
            {
                return false;
            }
        }

        return true;
    }

    protected override void ReadCore(int channel, long start, Span<float> destination) =>
        ReadCore([channel], start, destination.Length, destination);

    protected override void ReadCore(ReadOnlySpan<int> channels, long start, int count, Span<float> destination)
    {
        if (count == 0 || channels.Length == 0)
        {
            return;
        }

        var spr = _channelSignals[channels[0]].SamplesPerRecord;
        var bps = _header.BytesPerSample;
        var end = start + count;
        var pos = start;
        var segment = _timeline.FindSegment(pos, spr);
        while (pos < end)
        {
            var segmentStart = _timeline.SegmentStart(segment, spr);
            var segmentEnd = segmentStart + (long)_timeline[segment].RecordCount * spr;
            if (pos >= segmentEnd)
            {
                // EDF+D gap: no sample is stored between this segment's end and the next one's start.
                var next = segment + 1 < _timeline.SegmentCount ? _timeline.SegmentStart(segment + 1, spr) : end;
                var stop = Math.Min(end, next);
                for (var k = 0; k < channels.Length; k++)
                {
                    destination.Slice(k * count + (int)(pos - start), (int)(stop - pos)).Fill(float.NaN);
                }

                pos = stop;
                segment++;
                continue;
            }

            var within = pos - segmentStart;
            var record = _timeline[segment].FirstRecord + (int)(within / spr);
            var first = (int)(within % spr);
            var n = (int)Math.Min(spr - first, end - pos);
            var bytes = Record(record);
            for (var k = 0; k < channels.Length; k++)
            {
                var c = channels[k];
                var source = bytes.Slice(_channelSignals[c].OffsetInRecord + first * bps, n * bps);
                var target = destination.Slice(k * count + (int)(pos - start), n);
                if (bps == 2)
                {
                    EdfSampleCodec.Decode16(source, target, _scale[c], _offset[c]);
                }
                else
                {
                    EdfSampleCodec.Decode24(source, target, _scale[c], _offset[c]);
                }
            }

            pos += n;
        }
    }

    protected override void Dispose(bool disposing)
    {
        if (disposing)
        {
            _file.Dispose();
        }
    }

    /// <summary>The bytes of one data record, from the buffer of whole records (refilled by one positioned read).</summary>
    private ReadOnlySpan<byte> Record(int record)
    {
        var size = _header.RecordBytes;
        if (_buffer is null || record < _cacheFirst || record >= _cacheFirst + _cacheCount)
        {
            _buffer ??= new byte[_chunkRecords * size];
            // Reading backwards, fill the buffer with the records before this one.
            var first = _cacheCount > 0 && record < _cacheFirst ? Math.Max(0, record - _chunkRecords + 1) : record;
            var n = Math.Min(_chunkRecords, _records - first);
            _cacheCount = 0;
            _file.ReadExactly(_header.HeaderBytes + (long)first * size, _buffer.AsSpan(0, n * size), $"data records {first + 1}–{first + n}");
            _cacheFirst = first;
            _cacheCount = n;
        }

        return _buffer.AsSpan((record - _cacheFirst) * size, size);
    }

    private static int CountRecords(ReadOnlyRecordingFile file, EdfHeader h)
    {
        var dataBytes = file.Length - h.HeaderBytes;
        var size = h.RecordBytes;
        var whole = dataBytes / size;
        var partial = dataBytes % size;
        if (h.DeclaredRecords == -1)
        {
            if (partial != 0)
            {
                RecordingFormatException.Throw(file.Path,
                    $"number of data records is -1 (unknown) and the file ends {partial} bytes into data record {whole + 1} (records are {size} bytes)",
                    h.HeaderBytes + whole * size, "number of data records");
            }

            if (whole > int.MaxValue)
            {
                RecordingFormatException.Throw(file.Path, $"the file holds {whole} data records, more than can be indexed", 236, "number of data records");
            }

            return (int)whole;
        }

        if (whole < h.DeclaredRecords)
        {
            var problem = $"declared {h.DeclaredRecords} data records of {size} bytes but the file holds {whole}";
            if (partial != 0)
            {
                problem += $" and ends {partial} bytes into data record {whole + 1}";
            }

            RecordingFormatException.Throw(file.Path, problem, h.HeaderBytes + whole * size, "number of data records");
        }

        return h.DeclaredRecords;
    }
}
