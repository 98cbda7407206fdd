using LongRecord.Formats.IO;

namespace LongRecord.Formats.Wfdb;

/// <summary>
/// Turns a parsed header into an open reader: checks what this reader supports, groups signals by file, opens the
/// files read-only and checks their lengths against the declared number of samples (at open, so a short file is
/// reported before any analysis starts).
/// </summary>
internal static class WfdbRecordOpener
{
    public static WfdbRecordReader Open(WfdbHeader header)
    {
        var path = header.FilePath;
        var formats = header.Signals.Select(s => CheckSupported(s, path)).ToArray();
        var groupRanges = GroupByFile(header, path);
        var directory = Path.GetDirectoryName(Path.GetFullPath(path)) ?? ".";

        string? missing = header.SignalCount == 0 ? "header declares no signals" : null;
        foreach (var (first, _) in groupRanges)
        {
            if (missing is null && !File.Exists(Path.Combine(directory, header.Signals[first].FileName)))
            {
                missing = $"no signal file ({header.Signals[first].FileName})";
            }
        }

        var groups = new List<WfdbSignalGroup>();
        try
        {
            long frames = header.SamplesPerSignal ?? 0;
            if (missing is null)
            {
                var files = groupRanges.Select(r => ReadOnlyRecordingFile.Open(Path.Combine(directory, header.Signals[r.First].FileName))).ToList();
                if (header.SamplesPerSignal is null)
                {
                    // header(5): no number of samples means "unspecified": take what every signal file holds.
                    frames = long.MaxValue;
                    for (var g = 0; g < groupRanges.Count; g++)
                    {
                        var (first, count) = groupRanges[g];
                        var frameSize = header.Signals.Skip(first).Take(count).Sum(s => s.SamplesPerFrame);
                        frames = Math.Min(frames, WfdbSignalGroup.FramesIn(files[g].Length, header.Signals[first].ByteOffset, formats[first], frameSize));
                    }
                }

                for (var g = 0; g < groupRanges.Count; g++)
                {
                    var (first, count) = groupRanges[g];
                    groups.Add(new WfdbSignalGroup(files[g], formats[first], header.Signals[first].ByteOffset, header.Signals.Skip(first).Take(count).ToArray(), frames));
                }

                foreach (var g in groups)
                {
                    CheckLength(header, g, frames);
                }
            }

            var map = BuildMap(header, formats, groupRanges, groups);
            var info = WfdbRecordInfo.Build(header, formats, frames, missing);
            return new WfdbRecordReader(header, info, [.. groups], map);
        }
        catch
        {
            foreach (var g in groups)
            {
                g.Dispose();
            }

            throw;
        }
    }

    private static WfdbFormat CheckSupported(WfdbSignalSpec s, string path)
    {
        var where = $"header line {s.LineNumber}";
        if (s.FileName == "-")
        {
            RecordingFormatException.Throw(path, $"{where}: signal file '-' (standard input) is not supported", s.LineByteOffset, "file name");
        }

        var format = WfdbFormat.TryGet(s.Format);
        if (format is null)
        {
            RecordingFormatException.Throw(path, $"{where}: signal format {s.Format} is not supported by this reader", s.LineByteOffset, "format");
        }

        // Skew is refused rather than applied: no reference data here has it, and header(5) leaves open how many
        // frames a skewed file must hold, so a guess could shift a channel silently.
        if (s.Skew != 0)
        {
            RecordingFormatException.Throw(path, $"{where}: signal skew (:{s.Skew}) is not supported", s.LineByteOffset, "skew");
        }

        return format;
    }

    /// <summary>Runs of consecutive signals that share a file (header(5): such entries must be consecutive).</summary>
    private static List<(int First, int Count)> GroupByFile(WfdbHeader header, string path)
    {
        var ranges = new List<(int First, int Count)>();
        var seen = new HashSet<string>(StringComparer.Ordinal);
        var s = header.Signals;
        for (var i = 0; i < s.Count;)
        {
            var j = i + 1;
            while (j < s.Count && s[j].FileName == s[i].FileName)
            {
                if (s[j].Format != s[i].Format)
                {
                    RecordingFormatException.Throw(path, $"header line {s[j].LineNumber}: signals in file '{s[i].FileName}' have different formats ({s[i].Format} and {s[j].Format})", s[j].LineByteOffset, "format");
                }

                if (s[j].ByteOffset != s[i].ByteOffset)
                {
                    RecordingFormatException.Throw(path, $"header line {s[j].LineNumber}: signals in file '{s[i].FileName}' have different byte offsets", s[j].LineByteOffset, "byte offset");
                }

                j++;
            }

            if (!seen.Add(s[i].FileName))
            {
                RecordingFormatException.Throw(path, $"header line {s[i].LineNumber}: signals in file '{s[i].FileName}' are not consecutive", s[i].LineByteOffset, "file name");
            }

            ranges.Add((i, j - i));
            i = j;
        }

        return ranges;
    }

    private static void CheckLength(WfdbHeader header, WfdbSignalGroup g, long frames)
    {
        var length = g.FileLength;
        var required = g.RequiredLength(frames);
        if (length >= required)
        {
            return;
        }

        var name = g.FileName;
        var whole = WfdbSignalGroup.FramesIn(length, g.ByteOffset, g.Format, g.FrameSize);
        var problem = g.RequiredLength(whole) == length
            ? $"signal file '{name}' holds {whole} frames ({length} bytes), fewer than the {frames} samples per signal the header declares"
            : $"signal file '{name}' ends inside frame {whole} ({length} bytes), before the {frames} samples per signal the header declares ({required} bytes)";
        RecordingFormatException.Throw(header.FilePath, problem, header.SamplesPerSignalByteOffset, "number of samples per signal");
    }

    private static WfdbChannelMap[] BuildMap(WfdbHeader header, WfdbFormat[] formats, List<(int First, int Count)> ranges, List<WfdbSignalGroup> groups)
    {
        var map = new WfdbChannelMap[header.SignalCount];
        for (var g = 0; g < ranges.Count; g++)
        {
            var (first, count) = ranges[g];
            for (var s = first; s < first + count; s++)
            {
                var spec = header.Signals[s];
                var mv = VoltageUnits.MillivoltsPer(spec.Units ?? "");
                var factor = double.IsNaN(mv) ? 1.0 : mv;
                var slot = groups.Count > 0 ? groups[g].SlotOfSignal[s - first] : 0;
                var invalid = formats[s].InvalidValue;
                map[s] = new WfdbChannelMap(g, slot, spec.SamplesPerFrame, spec.EffectiveBaseline, factor / spec.EffectiveGain, invalid.HasValue, invalid ?? 0);
            }
        }

        return map;
    }
}
