namespace LongRecord.Formats.Wfdb;

/// <summary>
/// Reads a PhysioNet WFDB record: a header (.hea, header(5)) and its signal files (signal(5)). Returns physical values
/// (digital − baseline) ÷ gain, in millivolts for voltage units; stored invalid-sample values read as NaN.
/// A header whose signal file is absent opens as metadata only (<see cref="RecordingInfo.HasSignal"/> false).
/// Signal file lengths are checked against the header when the record is opened.
/// </summary>
public sealed class WfdbRecordReader : RecordingReader
{
    private readonly WfdbSignalGroup[] _groups;
    private readonly WfdbChannelMap[] _map;

    internal WfdbRecordReader(WfdbHeader header, RecordingInfo info, WfdbSignalGroup[] groups, WfdbChannelMap[] map)
    {
        Header = header;
        Info = info;
        _groups = groups;
        _map = map;
    }

    public override RecordingInfo Info { get; }

    /// <summary>The parsed header, fields as written.</summary>
    public WfdbHeader Header { get; }

    /// <summary>
    /// Opens the record whose header is <paramref name="headerPath"/>; a path without the <c>.hea</c> extension names the
    /// record (<c>…/mitdb/100</c>). Signal files are found beside the header unless the header gives an absolute path.
    /// </summary>
    /// <exception cref="RecordingFormatException">The header is invalid, uses a feature not read here, or a signal file
    /// is shorter than the header declares.</exception>
    public static WfdbRecordReader Open(string headerPath)
    {
        ArgumentException.ThrowIfNullOrEmpty(headerPath);
        var isHeader = headerPath.EndsWith(".hea", StringComparison.OrdinalIgnoreCase)
            || (File.Exists(headerPath) && !File.Exists(headerPath + ".hea"));
        var path = isHeader ? headerPath : headerPath + ".hea";
        return WfdbRecordOpener.Open(WfdbHeader.Parse(path));
    }

    /// <summary>
    /// True when <paramref name="head"/> (the first bytes of a file) looks like a WFDB header: its first line that is
    /// neither blank nor a comment has the shape of a record line. Content-based; <paramref name="path"/> is not needed.
    /// </summary>
    public static bool SniffHeader(ReadOnlySpan<byte> head, string path) => WfdbHeaderSniffer.LooksLikeHeader(head);

    protected override void ReadCore(int channel, long start, Span<float> destination) =>
        ReadCore([channel], start, destination.Length, destination);

    protected override void ReadCore(ReadOnlySpan<int> channels, long start, int count, Span<float> destination)
    {
        if (count == 0)
        {
            return;
        }

        // Visit each signal file once and decode each of its frames once for every requested channel it holds.
        Span<bool> done = channels.Length <= 256 ? stackalloc bool[channels.Length] : new bool[channels.Length];
        for (var k = 0; k < channels.Length; k++)
        {
            if (done[k])
            {
                continue;
            }

            var group = _map[channels[k]].Group;
            var spf = _map[channels[k]].SamplesPerFrame;
            var g = _groups[group];
            var firstFrame = start / spf;
            var endFrame = (start + count - 1) / spf + 1;
            for (var frame = firstFrame; frame < endFrame;)
            {
                var n = (int)Math.Min(g.MaxFramesPerChunk, endFrame - frame);
                var stream = g.DecodeFrames(frame, n);
                var chunkStart = Math.Max(start, frame * spf);
                var chunkEnd = Math.Min(start + count, (frame + n) * spf);
                for (var j = k; j < channels.Length; j++)
                {
                    var m = _map[channels[j]];
                    if (m.Group != group)
                    {
                        continue;
                    }

                    done[j] = true;
                    var output = destination.Slice(j * count + (int)(chunkStart - start), (int)(chunkEnd - chunkStart));
                    WfdbScatter.Convert(stream, g.FrameSize, m, (int)(chunkStart - frame * spf), output);
                }

                frame += n;
            }
        }
    }

    protected override void Dispose(bool disposing)
    {
        if (disposing)
        {
            foreach (var g in _groups)
            {
                g.Dispose();
            }
        }
    }
}
