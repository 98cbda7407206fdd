namespace LongRecord.Formats.Edf;

/// <summary>
/// Streams an EDF+C (or BDF+C) file: samples and annotations in, data records out, with memory bounded by a few records.
/// The file is written under a temporary name beside <c>path</c> and renamed by <see cref="Complete"/>; disposing
/// without completing deletes it, so no partial file is ever left under the final name.
/// </summary>
/// <remarks>
/// <para>Samples are physical values: millivolts for voltage units (converted to the channel's unit), the channel's own
/// unit otherwise. Quantisation: digital = round(gain × physical + baseline), clamped to the digital range (saturation);
/// NaN is stored as the digital minimum.</para>
/// <para>Two ways in: <see cref="WriteSamples"/> takes a block of every channel at once (channels of one rate);
/// <see cref="Append"/> takes one channel's samples at any pace, which allows channels of different rates. A data record
/// is written once every channel has filled it.</para>
/// <para>Annotations go into the data record containing their onset if it is not yet written, else into the next record
/// not yet written; those that do not fit spill into later records, never dropped.</para>
/// <para><see cref="Complete"/> pads the last record with the digital minimum, not the last value: a padded tail then
/// reads as saturation (an obvious artefact) rather than as a flat line that could pass for asystole. Annotations still
/// queued then go into the remaining space of that record and, if they need more, into further padded records.</para>
/// </remarks>
public sealed class EdfWriter : IDisposable
{
    // Records assembled in memory before one write (common practice, no source: about 1 MiB per write).
    private const int OutputBytes = 1 << 20;

    private readonly string _path;
    private readonly string _tempPath;
    private readonly EdfWriterLayout _layout;
    private readonly FileStream _file;
    private readonly int[][] _pending;
    private readonly int[] _pendingCount;
    private readonly byte[] _output;
    private readonly int _outputCapacity;
    private readonly EdfAnnotationQueue _annotations = new();
    private readonly int _maxAnnotationTal;
    private readonly bool _oneRate;
    private int _outputRecords;
    private int _recordsWritten;
    private bool _completed;
    private bool _disposed;

    /// <summary>Checks <paramref name="options"/> and creates the temporary file with the header (record count −1).</summary>
    /// <exception cref="ArgumentException">The options cannot be written as EDF; the message lists every problem.</exception>
    public EdfWriter(string path, EdfWriterOptions options)
    {
        _layout = EdfWriterLayout.Create(options);
        _path = Path.GetFullPath(path);
        _tempPath = $"{_path}.{Guid.NewGuid():N}.partial";
        var channels = _layout.Channels;
        _pending = new int[channels.Count][];
        _pendingCount = new int[channels.Count];
        _outputCapacity = Math.Max(1, OutputBytes / _layout.RecordBytes);
        _output = new byte[_outputCapacity * _layout.RecordBytes];
        _maxAnnotationTal = _layout.AnnotationBytes - EdfWriterLayout.MaxTimeKeepingBytes;
        _oneRate = channels.All(c => c.SamplesPerRecord == channels[0].SamplesPerRecord);
        for (var c = 0; c < channels.Count; c++)
        {
            _pending[c] = new int[channels[c].SamplesPerRecord * 2];
        }

        _file = new FileStream(_tempPath, FileMode.CreateNew, FileAccess.Write, FileShare.None, bufferSize: 0);
        _file.Write(_layout.Header);
    }

    /// <summary>Data records written so far (assembled; some may still be in the output buffer).</summary>
    public int RecordsWritten => _recordsWritten;

    /// <summary>
    /// Appends <paramref name="count"/> samples to every channel: channel k's samples are
    /// <paramref name="samples"/>[k × count … k × count + count − 1]. All channels must have the same samples per record.
    /// </summary>
    public void WriteSamples(ReadOnlySpan<float> samples, int count)
    {
        ThrowIfDone();
        var channels = _layout.Channels;
        ArgumentOutOfRangeException.ThrowIfNegative(count);
        if (samples.Length < (long)channels.Count * count)
        {
            throw new ArgumentException($"samples holds {samples.Length} values; {channels.Count} channels × {count} are needed", nameof(samples));
        }

        if (!_oneRate)
        {
            throw new InvalidOperationException("WriteSamples needs channels of one rate; use Append for channels of different rates");
        }

        // Quantise at most a buffer's worth of records per pass so memory stays flat however large the block.
        var piece = Math.Max(1, _outputCapacity) * (channels.Count == 0 ? 1 : channels[0].SamplesPerRecord);
        for (var done = 0; done < count; done += piece)
        {
            var n = Math.Min(piece, count - done);
            for (var c = 0; c < channels.Count; c++)
            {
                Quantise(c, samples.Slice(c * count + done, n));
            }

            EmitReady();
        }
    }

    /// <summary>Appends samples to one channel; records are written once every channel has filled them.</summary>
    public void Append(int channel, ReadOnlySpan<float> samples)
    {
        ThrowIfDone();
        ArgumentOutOfRangeException.ThrowIfNegative(channel);
        ArgumentOutOfRangeException.ThrowIfGreaterThanOrEqual(channel, _layout.Channels.Count);
        var piece = _outputCapacity * _layout.Channels[channel].SamplesPerRecord;
        for (var done = 0; done < samples.Length; done += piece)
        {
            Quantise(channel, samples.Slice(done, Math.Min(piece, samples.Length - done)));
            EmitReady();
        }
    }

    /// <summary>
    /// Queues an annotation at <paramref name="onsetS"/> seconds after the first sample.
    /// </summary>
    /// <exception cref="ArgumentException">The text is empty, holds the TAL delimiters 0x00, 0x14 or 0x15, or is too long for
    /// the annotation bytes a record reserves (see <see cref="EdfWriterOptions.AnnotationBytesPerRecord"/>).</exception>
    public void AddAnnotation(double onsetS, double? durationS, string text)
    {
        ThrowIfDone();
        ArgumentNullException.ThrowIfNull(text);
        if (!double.IsFinite(onsetS) || durationS is double d && (!double.IsFinite(d) || d < 0))
        {
            throw new ArgumentOutOfRangeException(nameof(onsetS), "onset must be finite and duration finite and not negative");
        }

        if (text.Length == 0 || text.AsSpan().IndexOfAny('\0', '\u0014', '\u0015') >= 0)
        {
            throw new ArgumentException("annotation text must be non-empty and free of the TAL delimiters 0x00, 0x14 and 0x15", nameof(text));
        }

        var tal = EdfNumberText.AnnotationTal(onsetS + _layout.StartFractionS, durationS, text);
        if (tal.Length > _maxAnnotationTal)
        {
            throw new ArgumentException(
                $"annotation '{text}' needs {tal.Length} bytes but a data record has room for {_maxAnnotationTal} after its time-keeping TAL; raise {nameof(EdfWriterOptions)}.{nameof(EdfWriterOptions.AnnotationBytesPerRecord)}",
                nameof(text));
        }

        var record = (int)Math.Clamp(Math.Floor(onsetS / _layout.RecordDurationS), 0, int.MaxValue);
        _annotations.Add(Math.Max(record, _recordsWritten), tal);
    }

    /// <summary>
    /// Pads the last record, writes queued annotations, sets the record count in the header and renames the file to its
    /// final name (replacing an existing file).
    /// </summary>
    public void Complete()
    {
        ThrowIfDone();
        var channels = _layout.Channels;
        var records = 0;
        for (var c = 0; c < channels.Count; c++)
        {
            records = Math.Max(records, (_pendingCount[c] + channels[c].SamplesPerRecord - 1) / channels[c].SamplesPerRecord);
        }

        PadTo(records);
        if (records > 1)
        {
            EmitRecords(records - 1, drainAll: false);
        }

        if (records > 0)
        {
            // The last record takes every queued annotation that fits, whatever record its onset falls in.
            EmitRecords(1, drainAll: true);
        }

        while (_annotations.Count > 0)
        {
            PadTo(1);
            EmitRecords(1, drainAll: true);
        }

        Flush();
        EdfWriterLayout.SetRecordCount(_layout.Header, _recordsWritten);
        _file.Seek(0, SeekOrigin.Begin);
        _file.Write(_layout.Header);
        _file.Dispose();
        File.Move(_tempPath, _path, overwrite: true);
        _completed = true;
    }

    /// <summary>Closes the writer; without <see cref="Complete"/> the temporary file is deleted.</summary>
    public void Dispose()
    {
        if (_disposed)
        {
            return;
        }

        _disposed = true;
        if (!_completed)
        {
            _file.Dispose();
            File.Delete(_tempPath);
        }
    }

    private void Quantise(int channel, ReadOnlySpan<float> samples)
    {
        var s = _layout.Channels[channel];
        var need = _pendingCount[channel] + samples.Length;
        if (need > _pending[channel].Length)
        {
            Array.Resize(ref _pending[channel], Math.Max(need, _pending[channel].Length * 2));
        }

        EdfSampleCodec.Quantise(samples, _pending[channel].AsSpan(_pendingCount[channel], samples.Length), s.Gain, s.Baseline, s.DigitalMin, s.DigitalMax);
        _pendingCount[channel] = need;
    }

    /// <summary>Pads every channel with the digital minimum to exactly <paramref name="records"/> more records' worth.</summary>
    private void PadTo(int records)
    {
        for (var c = 0; c < _layout.Channels.Count; c++)
        {
            var s = _layout.Channels[c];
            var target = records * s.SamplesPerRecord;
            if (_pendingCount[c] >= target)
            {
                continue;
            }

            if (target > _pending[c].Length)
            {
                Array.Resize(ref _pending[c], target);
            }

            _pending[c].AsSpan(_pendingCount[c], target - _pendingCount[c]).Fill(s.DigitalMin);
            _pendingCount[c] = target;
        }
    }

    private void EmitReady()
    {
        var channels = _layout.Channels;
        if (channels.Count == 0)
        {
            return;
        }

        var ready = int.MaxValue;
        for (var c = 0; c < channels.Count; c++)
        {
            ready = Math.Min(ready, _pendingCount[c] / channels[c].SamplesPerRecord);
        }

        if (ready > 0)
        {
            EmitRecords(ready, drainAll: false);
        }
    }

    /// <summary>Assembles <paramref name="count"/> records from the front of every channel's pending samples.</summary>
    private void EmitRecords(int count, bool drainAll)
    {
        var channels = _layout.Channels;
        var bps = _layout.BytesPerSample;
        for (var k = 0; k < count; k++)
        {
            var record = _output.AsSpan(_outputRecords * _layout.RecordBytes, _layout.RecordBytes);
            for (var c = 0; c < channels.Count; c++)
            {
                var s = channels[c];
                var digital = _pending[c].AsSpan(k * s.SamplesPerRecord, s.SamplesPerRecord);
                var target = record.Slice(s.OffsetInRecord, s.SamplesPerRecord * bps);
                if (bps == 2)
                {
                    EdfSampleCodec.Encode16(digital, target);
                }
                else
                {
                    EdfSampleCodec.Encode24(digital, target);
                }
            }

            var annotations = record.Slice(_layout.Annotation.OffsetInRecord, _layout.AnnotationBytes);
            annotations.Clear();
            var timeKeeping = EdfNumberText.TimeKeepingTal(_layout.StartFractionS + _recordsWritten * _layout.RecordDurationS);
            timeKeeping.CopyTo(annotations);
            _annotations.Drain(drainAll ? int.MaxValue : _recordsWritten, annotations[timeKeeping.Length..]);
            _recordsWritten++;
            if (++_outputRecords == _outputCapacity)
            {
                Flush();
            }
        }

        for (var c = 0; c < channels.Count; c++)
        {
            var used = count * channels[c].SamplesPerRecord;
            _pendingCount[c] -= used;
            Array.Copy(_pending[c], used, _pending[c], 0, _pendingCount[c]);
        }
    }

    private void Flush()
    {
        _file.Write(_output, 0, _outputRecords * _layout.RecordBytes);
        _outputRecords = 0;
    }

    private void ThrowIfDone()
    {
        ObjectDisposedException.ThrowIf(_disposed, this);
        if (_completed)
        {
            throw new InvalidOperationException("the EDF file is already complete");
        }
    }
}
