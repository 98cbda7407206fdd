using LongRecord.Analysis.Beats.Delineation;
using LongRecord.Analysis.Conditioning;

namespace LongRecord.Analysis.Tests.Delineation;

/// <summary>
/// Runs the delineator as the pipeline will: every lead conditioned with <see cref="EcgConditioner"/>, then each beat
/// delineated in time order in a window from 0.5 s before to 0.7 s after its fiducial. Results are turned back into
/// sample indices of the recording (−1 where not found).
/// </summary>
internal static class DelineationRun
{
    public const double PreS = 0.5;
    public const double PostS = 0.7;

    /// <summary>Conditioned copies of <paramref name="leads"/>.</summary>
    public static float[][] Condition(IReadOnlyList<float[]> leads, double samplingRateHz)
    {
        var result = new float[leads.Count][];
        for (var k = 0; k < leads.Count; k++)
        {
            result[k] = (float[])leads[k].Clone();
            new EcgConditioner(samplingRateHz).Process(result[k]);
        }

        return result;
    }

    /// <summary>
    /// Delineates the beats at <paramref name="fiducials"/> (ascending sample indices); a neighbour further than
    /// <paramref name="maxNeighbourS"/> away is not passed as context.
    /// </summary>
    public static DelineatedBeat[] Run(float[][] conditioned, double samplingRateHz, IReadOnlyList<long> fiducials, double maxNeighbourS = 3.0, DelineationSettings? settings = null)
    {
        var leads = conditioned.Length;
        var length = conditioned[0].Length;
        var pre = (int)Math.Round(PreS * samplingRateHz);
        var post = (int)Math.Round(PostS * samplingRateHz);
        var maxGap = (long)(maxNeighbourS * samplingRateHz);
        var delineator = new BeatDelineator(samplingRateHz, leads, settings);
        var window = new float[leads * (pre + post + 1)];
        var results = new DelineatedBeat[fiducials.Count];
        for (var i = 0; i < fiducials.Count; i++)
        {
            var s = fiducials[i];
            var start = Math.Max(0, s - pre);
            var end = Math.Min(length, s + post + 1);
            var n = (int)(end - start);
            for (var k = 0; k < leads; k++)
            {
                conditioned[k].AsSpan((int)start, n).CopyTo(window.AsSpan(k * n, n));
            }

            int? prev = i > 0 && s - fiducials[i - 1] <= maxGap ? (int)(fiducials[i - 1] - start) : null;
            int? next = i + 1 < fiducials.Count && fiducials[i + 1] - s <= maxGap ? (int)(fiducials[i + 1] - start) : null;
            var d = delineator.Delineate(window, n, (int)(s - start), new DelineationContext(prev, next, 0));
            results[i] = new DelineatedBeat(
                s, At(d.QrsOnset, start), At(d.QrsOffset, start), d.QrsMs, At(d.RPeak, start), d.PWave, At(d.PPeak, start), At(d.TEnd, start));
        }

        return results;
    }

    private static long At(int index, long start) => index >= 0 ? start + index : -1;
}

/// <summary>One delineated beat in recording sample indices.</summary>
internal readonly record struct DelineatedBeat(long Fiducial, long QrsOnset, long QrsOffset, float QrsMs, long RPeak, sbyte PWave, long PPeak, long TEnd)
{
    public bool HasQrsBounds => QrsOnset >= 0 && QrsOffset >= 0;
}
