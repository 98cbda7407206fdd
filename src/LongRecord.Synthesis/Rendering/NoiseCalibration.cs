using LongRecord.Synthesis.Model;
using LongRecord.Synthesis.Timeline;

namespace LongRecord.Synthesis.Rendering;

/// <summary>
/// Sets each noise stretch's per-lead gain so that its SNR is exactly the scripted one, by the definition of the
/// MIT-BIH noise stress test (Moody, Muldrow and Mark, "A noise stress test for arrhythmia detectors", Computers in
/// Cardiology 11:381–384, 1984; from memory): signal power from the QRS peak-to-peak amplitude as the power of a
/// sinusoid of that peak-to-peak amplitude, noise power as the noise's mean square.
/// <para>
/// Our exact formula, per lead l of the stretch:
/// S_l = (median over the beats whose R lies in the stretch of the clean QRS peak-to-peak amplitude in lead l)² / 8;
/// N_l = mean over the stretch's samples of noise_l(n)² (the added noise itself, taper included, mean not removed);
/// SNR_l = 10 log10(S_l / N_l) dB. A stretch without beats takes the normal QRS of that lead for S_l.
/// </para>
/// </summary>
internal static class NoiseCalibration
{
    public static double SignalPower(Complex[] complexes, LeadMorphologies morph, int lead, double startS, double endS)
    {
        var pp = new List<double>();
        foreach (var c in complexes)
        {
            if (c.IsBeat && c.RTimeS >= startS && c.RTimeS < endS)
            {
                pp.Add(morph.QrsPeakToPeakMv[c.Morph][lead] * c.QrsScale);
            }
        }

        var median = pp.Count == 0 ? morph.QrsPeakToPeakMv[WaveCatalogue.Normal][lead] : Median(pp);
        return median * median / 8.0;
    }

    public static void Calibrate(NoiseSource source, Complex[] complexes, LeadMorphologies morph)
    {
        var snr = source.Placed.Stretch.SnrDb;
        if (snr is not double snrDb || source.EndSample <= source.StartSample)
        {
            return;
        }

        var buffer = new double[8192];
        for (var lead = 0; lead < source.LeadMask.Length; lead++)
        {
            if (!source.LeadMask[lead])
            {
                continue;
            }

            var sum = 0.0;
            for (var n = source.StartSample; n < source.EndSample; n += buffer.Length)
            {
                var span = buffer.AsSpan(0, (int)Math.Min(buffer.Length, source.EndSample - n));
                source.Raw(lead, n, span);
                foreach (var v in span)
                {
                    sum += v * v;
                }
            }

            var rawPower = sum / (source.EndSample - source.StartSample);
            var signal = SignalPower(complexes, morph, lead, source.Placed.StartS, source.Placed.EndS);
            source.Gain[lead] = rawPower > 0 ? Math.Sqrt(signal / Math.Pow(10, snrDb / 10.0) / rawPower) : 0;
        }
    }

    private static double Median(List<double> values)
    {
        values.Sort();
        var m = values.Count / 2;
        return values.Count % 2 == 1 ? values[m] : 0.5 * (values[m - 1] + values[m]);
    }
}
