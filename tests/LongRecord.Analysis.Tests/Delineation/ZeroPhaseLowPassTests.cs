using LongRecord.Analysis.Beats.Delineation;

namespace LongRecord.Analysis.Tests.Delineation;

/// <summary>
/// The delineator's zero-phase low-pass against the textbook response of a second-order Butterworth low-pass made
/// digital by the bilinear transform with the corner pre-warped: |H(f)|² = 1 / (1 + (tan(πf/fs) / tan(πfc/fs))⁴)
/// (Oppenheim and Schafer, Discrete-Time Signal Processing, bilinear transformation; from memory). Run forward and
/// backward, the stretch is filtered by |H|², with no delay.
/// </summary>
public sealed class ZeroPhaseLowPassTests
{
    private const double Fs = 250;

    [Theory]
    [InlineData(25, 5)]
    [InlineData(25, 25)]
    [InlineData(25, 40)]
    [InlineData(15, 10)]
    [InlineData(60, 60)]
    public void Sine_AmplitudeScaledBySquaredButterworthResponse(double cornerHz, double sineHz)
    {
        var n = 2000;
        var x = new float[n];
        for (var i = 0; i < n; i++)
        {
            x[i] = (float)Math.Sin(2 * Math.PI * sineHz * i / Fs);
        }

        var y = Filter(new ZeroPhaseLowPass(cornerHz, Fs), x);

        // Amplitude and phase in the middle, away from the start-up at both ends: least squares on sin and cos.
        double ss = 0, sc = 0;
        for (var i = 500; i < 1500; i++)
        {
            ss += y[i] * Math.Sin(2 * Math.PI * sineHz * i / Fs);
            sc += y[i] * Math.Cos(2 * Math.PI * sineHz * i / Fs);
        }

        var amplitude = 2 * Math.Sqrt(ss * ss + sc * sc) / 1000;
        var ratio = Math.Tan(Math.PI * sineHz / Fs) / Math.Tan(Math.PI * cornerHz / Fs);
        var expected = 1 / (1 + Math.Pow(ratio, 4));

        // 0.5 % of full scale: the float samples and the 1000-sample fit (common practice, no source).
        Assert.InRange(amplitude, expected - 0.005, expected + 0.005);

        // Zero phase: the cosine part (a shift) stays under 0.5 % of full scale.
        Assert.InRange(2 * sc / 1000, -0.005, 0.005);
    }

    [Fact]
    public void SymmetricPulse_PeakStaysInPlace()
    {
        // A causal filter delays a pulse; forward-backward filtering must not (the wave boundaries rest on it).
        var x = new float[301];
        for (var i = 0; i < x.Length; i++)
        {
            x[i] = (float)Math.Exp(-0.5 * Math.Pow((i - 150) / 6.0, 2));
        }

        var y = Filter(new ZeroPhaseLowPass(25, Fs), x);
        Assert.Equal(150, Array.IndexOf(y, y.Max()));
        Assert.Equal(y[140], y[160], 4);
    }

    [Fact]
    public void Constant_PassesUnchanged()
    {
        // Each pass starts in the steady state of its first value: a level (a baseline offset) gives no start-up swing.
        var x = Enumerable.Repeat(1.25f, 120).ToArray();
        var y = Filter(new ZeroPhaseLowPass(15, Fs), x);
        Assert.All(y, v => Assert.Equal(1.25, v, 5));
    }

    [Fact]
    public void FourLanes_VectorAndLaneByLaneAgreeExactly()
    {
        // Four different stretches and two filters at once; the processor's vector path and the path without vectors
        // must give the same samples bit for bit, so results never depend on the machine.
        // Lengths around multiples of four: the vector path takes four samples at a time and the rest one by one.
        var rnd = new Random(7);
        var filters = new[] { new ZeroPhaseLowPass(25, Fs), new ZeroPhaseLowPass(15, Fs), new ZeroPhaseLowPass(25, Fs), new ZeroPhaseLowPass(60, Fs) };
        foreach (var length in new[] { 1, 2, 3, 4, 5, 7, 8, 257, 258, 259, 260 })
        {
            var sources = Enumerable.Range(0, 4).Select(_ => Enumerable.Range(0, length).Select(_ => (float)(rnd.NextDouble() - 0.5)).ToArray()).ToArray();
            for (var count = 1; count <= 4; count++)
            {
                var a = Enumerable.Range(0, 4).Select(_ => new float[length]).ToArray();
                var b = Enumerable.Range(0, 4).Select(_ => new float[length]).ToArray();
                var work = new double[4 * length];
                var lanes = new FilterLanes();
                var single = new FilterLanes();
                for (var k = 0; k < count; k++)
                {
                    lanes.Add(sources[k], filters[k], a[k]);
                    single.Add(sources[k], filters[k], b[k]);
                }

                ZeroPhaseLowPass.Run(ref lanes, work);
                ZeroPhaseLowPass.RunLaneByLane(ref single, work);
                for (var k = 0; k < 4; k++)
                {
                    Assert.Equal(b[k], a[k]);
                }
            }
        }
    }

    private static float[] Filter(ZeroPhaseLowPass filter, float[] x)
    {
        var y = new float[x.Length];
        var lanes = new FilterLanes();
        lanes.Add(x, filter, y);
        lanes.Flush(new double[4 * x.Length]);
        return y;
    }
}
