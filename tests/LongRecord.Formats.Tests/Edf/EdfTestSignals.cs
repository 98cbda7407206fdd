using LongRecord.Formats.Edf;

namespace LongRecord.Formats.Tests.Edf;

/// <summary>Synthetic test signals and writer set-ups shared by the EDF tests (fixed seeds, so every run is identical).</summary>
internal static class EdfTestSignals
{
    /// <summary>
    /// <paramref name="count"/> samples of a sum of sines plus Gaussian-ish noise (sum of uniforms), peak about
    /// <paramref name="amplitude"/>; <paramref name="seed"/> fixes the noise.
    /// </summary>
    public static float[] Make(int count, double rateHz, double amplitude, int seed)
    {
        var random = new Random(seed);
        var x = new float[count];
        for (var i = 0; i < count; i++)
        {
            var t = i / rateHz;
            var noise = (random.NextDouble() + random.NextDouble() + random.NextDouble() - 1.5) * 0.1;
            x[i] = (float)(amplitude * (0.6 * Math.Sin(2 * Math.PI * 1.2 * t + seed) + 0.3 * Math.Sin(2 * Math.PI * 17 * t) + noise));
        }

        return x;
    }

    /// <summary>Lays channels out one after another, as <see cref="EdfWriter.WriteSamples"/> takes them.</summary>
    public static float[] Interleave(IReadOnlyList<float[]> channels, int start, int count)
    {
        var block = new float[channels.Count * count];
        for (var k = 0; k < channels.Count; k++)
        {
            channels[k].AsSpan(start, count).CopyTo(block.AsSpan(k * count));
        }

        return block;
    }

    /// <summary>Writes <paramref name="signals"/> (one array per channel, all of one rate) in blocks of <paramref name="block"/> samples.</summary>
    public static void Write(string path, EdfWriterOptions options, IReadOnlyList<float[]> signals, int block, Action<EdfWriter>? annotate = null)
    {
        using var writer = new EdfWriter(path, options);
        annotate?.Invoke(writer);
        var n = signals[0].Length;
        for (var s = 0; s < n; s += block)
        {
            var count = Math.Min(block, n - s);
            writer.WriteSamples(Interleave(signals, s, count), count);
        }

        writer.Complete();
    }

    /// <summary>Two ECG leads in mV and one in µV at 250 Hz, 1-s records, invented patient of the LongRecord demo clinic.</summary>
    public static EdfWriterOptions ThreeLeads(bool bdf = false) => new()
    {
        Channels =
        [
            new EdfWriterChannel { Label = "ECG I", Transducer = "Ag/AgCl electrode", PhysicalUnit = "mV", PhysicalMin = -5, PhysicalMax = 5, Prefilter = "HP:0.05Hz LP:40Hz", SamplesPerRecord = 250 },
            new EdfWriterChannel { Label = "ECG II", PhysicalUnit = "mV", PhysicalMin = -3.2768, PhysicalMax = 3.2767, SamplesPerRecord = 250 },
            new EdfWriterChannel { Label = "ECG V5", PhysicalUnit = "uV", PhysicalMin = -4000, PhysicalMax = 4000, SamplesPerRecord = 250 },
        ],
        Start = new DateTime(2024, 3, 5, 21, 30, 15),
        PatientCode = "LR-0042",
        PatientSex = "F",
        PatientBirthDate = new DateOnly(1961, 8, 2),
        PatientName = "Testperson Ada",
        AdminCode = "HOLT-7",
        Technician = "Tech_B",
        Equipment = "Demo recorder 3",
        Bdf = bdf,
    };
}
