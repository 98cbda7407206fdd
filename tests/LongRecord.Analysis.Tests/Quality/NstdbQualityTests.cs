using LongRecord.Analysis.Quality;
using LongRecord.Analysis.Tests.Support;
using Xunit.Abstractions;

namespace LongRecord.Analysis.Tests.Quality;

/// <summary>
/// MIT-BIH Noise Stress Test Database: record 118 with electrode-motion noise added by <c>nst</c> at 24, 12, 6, 0 and
/// −6 dB in 2-minute stretches alternating with clean ones from 5:00 on (Moody, Muldrow and Mark 1984; the database's
/// README). The noise stretches are derived from the data: 118eXX minus MITDB 118, per second, after removing the
/// second's mean (nst also shifts the baseline); the <c>~</c> marks of the .atr files are 118's own and do not mark them.
/// </summary>
public sealed class NstdbQualityTests(ITestOutputHelper output)
{
    private static readonly string[] s_records = ["118e24", "118e12", "118e06", "118e00", "118e_6"];

    [Fact]
    public void NoiseStretches_DerivedFromTheSignal_MatchTheDatabaseDescription()
    {
        var clean = ReferenceRecord.Load("mitdb", "118");
        foreach (var name in s_records)
        {
            var record = ReferenceRecord.Load("nstdb", name);
            var noisy = NoisySeconds(record, clean);
            for (var s = 0; s < noisy.Length; s++)
            {
                // Noise in [300 + 240 i, 420 + 240 i) s: the README's 2-minute stretches from 5:00.
                var expected = s >= 300 && (s - 300) % 240 < 120;
                Assert.True(expected == noisy[s], $"{name} second {s}: noise {noisy[s]}, expected {expected}");
            }

            // The annotation files are 118's, so their ~ marks are not the added noise.
            Assert.Equal(clean.Annotations.Count, record.Annotations.Count);
            Assert.True(clean.Annotations.Zip(record.Annotations).All(p => p.First == p.Second), $"{name}.atr differs from 118.atr");
        }
    }

    [Fact]
    public void ExcludedFraction_GrowsAsSnrDrops_CleanStretchesKept()
    {
        var clean = ReferenceRecord.Load("mitdb", "118");
        var previous = -1.0;
        foreach (var name in s_records)
        {
            var record = ReferenceRecord.Load("nstdb", name);
            var noisy = NoisySeconds(record, clean);
            var windows = QualityRun.Windows(record);
            var noise = windows.Where(w => w.Index < noisy.Length && noisy[w.Index] && w.Index > 0 && noisy[w.Index - 1] && w.Index + 1 < noisy.Length && noisy[w.Index + 1]).ToList();
            var quiet = windows.Where(w => w.Index < noisy.Length && !noisy[w.Index] && (w.Index == 0 || !noisy[w.Index - 1]) && (w.Index + 1 >= noisy.Length || !noisy[w.Index + 1])).ToList();
            double Excluded(List<QualityWindow> ws) => ws.Count(w => !w.Analysable) / (double)ws.Count;
            double NotGood(List<QualityWindow> ws, int lead) => ws.Count(w => w.State(lead) != LeadState.Good) / (double)ws.Count;
            var snr = name == "118e_6" ? -6 : int.Parse(name[4..]);
            output.WriteLine(FormattableString.Invariant(
                $"{name} ({snr} dB): excluded {100 * Excluded(noise):F1} % of noise windows, {100 * Excluded(quiet):F1} % of clean; lead not good in noise {100 * NotGood(noise, 0):F1} % / {100 * NotGood(noise, 1):F1} %, in clean {100 * NotGood(quiet, 0):F1} % / {100 * NotGood(quiet, 1):F1} % (MLII / V1)"));
            Assert.True(Excluded(quiet) < 0.01, $"{name}: {Excluded(quiet):P1} of clean windows excluded");
            Assert.True(Excluded(noise) >= previous, $"{name}: excluded share {Excluded(noise):P1} fell below {previous:P1} at a higher SNR");
            if (snr <= 6)
            {
                for (var lead = 0; lead < 2; lead++)
                {
                    Assert.True(NotGood(noise, lead) >= 0.5, $"{name} lead {lead}: noisy in {NotGood(noise, lead):P1} of noise windows");
                    Assert.True(NotGood(quiet, lead) <= 0.05, $"{name} lead {lead}: not good in {NotGood(quiet, lead):P1} of clean windows");
                }
            }

            if (snr == -6)
            {
                Assert.True(Excluded(noise) > 0.5, $"{name}: only {Excluded(noise):P1} of noise windows excluded");
            }

            previous = Excluded(noise);
        }
    }

    private static bool[] NoisySeconds(ReferenceRecord record, ReferenceRecord clean)
    {
        var fs = (int)record.SamplingRateHz;
        var seconds = (int)(record.SampleCount / fs);
        var noisy = new bool[seconds];
        for (var s = 0; s < seconds; s++)
        {
            for (var k = 0; k < 2 && !noisy[s]; k++)
            {
                double mean = 0;
                for (var i = s * fs; i < (s + 1) * fs; i++)
                {
                    mean += record.Leads[k][i] - clean.Leads[k][i];
                }

                mean /= fs;
                for (var i = s * fs; i < (s + 1) * fs && !noisy[s]; i++)
                {
                    // Half a quantisation step (5 µV): any added noise shows.
                    noisy[s] = Math.Abs(record.Leads[k][i] - clean.Leads[k][i] - mean) > 0.0025 + 1e-4;
                }
            }
        }

        return noisy;
    }
}
