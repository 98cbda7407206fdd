using LongRecord.Formats.Edf;

namespace LongRecord.Benchmarks.Formats;

/// <summary>Test recordings written once into the temp folder: a plausible two-lead ECG-like signal at 250 Hz.</summary>
public static class BenchmarkRecordings
{
    public const double RateHz = 250;

    public static string Folder { get; } = Path.Combine(Path.GetTempPath(), "longrecord-bench");

    /// <summary>An EDF+C file of <paramref name="hours"/> hours, two leads, 1-s records.</summary>
    public static string Edf(double hours)
    {
        var path = Path.Combine(Folder, $"bench-{hours:0.##}h.edf");
        if (File.Exists(path))
        {
            return path;
        }

        Directory.CreateDirectory(Folder);
        var channels = new[] { "ECG1", "ECG2" }.Select(l => new EdfWriterChannel
        {
            Label = l, PhysicalMin = -5, PhysicalMax = 5, SamplesPerRecord = (int)RateHz,
        }).ToArray();
        using var w = new EdfWriter(path, new EdfWriterOptions { Channels = channels, Start = new DateTime(2026, 3, 2, 9, 0, 0) });
        var block = new float[2 * (int)RateHz];
        var records = (long)(hours * 3600);
        for (long r = 0; r < records; r++)
        {
            Fill(block, r * (long)RateHz, (int)RateHz);
            w.WriteSamples(block, (int)RateHz);
        }

        w.Complete();
        return path;
    }

    /// <summary>A WFDB record in format 212 of <paramref name="hours"/> hours, two signals; returns the header path.</summary>
    public static string Wfdb212(double hours)
    {
        var name = $"bench212-{hours:0.##}h";
        var hea = Path.Combine(Folder, name + ".hea");
        if (File.Exists(hea))
        {
            return hea;
        }

        Directory.CreateDirectory(Folder);
        var n = (long)(hours * 3600 * RateHz);
        var block = new float[2 * 4096];
        using (var dat = new FileStream(Path.Combine(Folder, name + ".dat"), FileMode.Create))
        {
            var bytes = new byte[3 * 4096];
            for (long s = 0; s < n; s += 4096)
            {
                var count = (int)Math.Min(4096, n - s);
                Fill(block, s, count);
                for (var i = 0; i < count; i++)
                {
                    // Format 212: two 12-bit samples in three bytes (WFDB signal(5)).
                    var a = Math.Clamp((int)Math.Round(block[i] * 200), -2047, 2047) & 0xFFF;
                    var b = Math.Clamp((int)Math.Round(block[count + i] * 200), -2047, 2047) & 0xFFF;
                    bytes[3 * i] = (byte)a;
                    bytes[3 * i + 1] = (byte)(((a >> 8) & 0x0F) | ((b >> 4) & 0xF0));
                    bytes[3 * i + 2] = (byte)b;
                }

                dat.Write(bytes, 0, 3 * count);
            }
        }

        File.WriteAllText(hea, $"{name} 2 {RateHz} {n}\n{name}.dat 212 200 12 0 0 0 0 ECG1\n{name}.dat 212 200 12 0 0 0 0 ECG2\n");
        return hea;
    }

    // Lead-major block of a QRS-like spike train at 70 bpm plus a slow wave and small noise.
    private static void Fill(Span<float> block, long start, int count)
    {
        for (var i = 0; i < count; i++)
        {
            var t = (start + i) / RateHz;
            var phase = t * 70 / 60 % 1.0;
            var qrs = Math.Exp(-Math.Pow((phase - 0.3) / 0.012, 2));
            var wave = 0.1 * Math.Sin(2 * Math.PI * 0.3 * t);
            var noise = 0.01 * Math.Sin(1234.5 * t * t % 6.283);
            block[i] = (float)(1.2 * qrs + wave + noise);
            block[count + i] = (float)(-0.6 * qrs + 0.5 * wave + noise);
        }
    }
}
