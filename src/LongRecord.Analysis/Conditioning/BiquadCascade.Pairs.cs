using System.Runtime.InteropServices;
using System.Runtime.Intrinsics;
using System.Runtime.Intrinsics.X86;

namespace LongRecord.Analysis.Conditioning;

public sealed partial class BiquadCascade
{
    /// <summary>
    /// Filters two signals at once: this cascade over <paramref name="first"/> and <paramref name="other"/> (with as
    /// many sections) over <paramref name="second"/>, each in place. The same results, bit for bit, as
    /// <c>Process(first)</c> and <c>other.Process(second)</c>.
    /// </summary>
    /// <remarks>
    /// Each section's recursion is a chain of dependent multiply-adds that leaves the processor idle between its steps;
    /// two signals in the two lanes of one vector share the chain's latency (about 2× faster for two leads). Each lane
    /// does the scalar loop's operations in its order (no fused multiply-add), so the rounding is the same. The samples
    /// go into the lanes and back four at a time (interleaved as floats, converted four to a 256-bit vector, outside the
    /// recursion), as in <see cref="ProcessFour"/>: against loading and storing them lane by lane inside it, 24 h of two
    /// leads at 250 Hz went from 0.103–0.107 s to 0.099–0.100 s per cascade (best of 7, three sections or two), which is
    /// the recursion's own bound: each sample waits on the previous one through a multiply and three additions. Without
    /// AVX the samples go in and out one at a time.
    /// </remarks>
    public void ProcessWith(BiquadCascade other, Span<float> first, Span<float> second)
    {
        if (other.Sections != Sections)
        {
            throw new ArgumentException($"the cascades differ in sections ({Sections} and {other.Sections})", nameof(other));
        }

        if (first.Length != second.Length)
        {
            throw new ArgumentException("the two signals differ in length", nameof(second));
        }

        if (Sections is not (2 or 3))
        {
            Process(first);
            other.Process(second);
            return;
        }

        Span<Vector128<double>> work = stackalloc Vector128<double>[WorkSamples];
        for (var done = 0; done < first.Length; done += WorkSamples)
        {
            var n = Math.Min(WorkSamples, first.Length - done);
            var x = work[..n];
            var a = first.Slice(done, n);
            var b = second.Slice(done, n);
            Interleave(a, b, x);
            if (Sections == 2)
            {
                PairTwo(other, x);
            }
            else
            {
                PairThree(other, x);
            }

            Deinterleave(x, a, b);
        }
    }

    // Sample i of the two signals into the two lanes of x[i], widened to double (exact). Four samples of each at a
    // time: the floats interleaved, then converted four to a 256-bit vector (two of x's elements).
    private static void Interleave(ReadOnlySpan<float> a, ReadOnlySpan<float> b, Span<Vector128<double>> x)
    {
        var i = 0;
        if (Avx.IsSupported)
        {
            var d = MemoryMarshal.Cast<Vector128<double>, double>(x);
            for (; i + 4 <= x.Length; i += 4)
            {
                var fa = Vector128.Create(a.Slice(i, 4));
                var fb = Vector128.Create(b.Slice(i, 4));
                Avx.ConvertToVector256Double(Sse.UnpackLow(fa, fb)).CopyTo(d.Slice(2 * i, 4));
                Avx.ConvertToVector256Double(Sse.UnpackHigh(fa, fb)).CopyTo(d.Slice(2 * i + 4, 4));
            }
        }

        for (; i < x.Length; i++)
        {
            x[i] = Vector128.Create(a[i], (double)b[i]);
        }
    }

    // The lanes of x back into the two signals, each rounded to the nearest float as a (float) cast rounds: four
    // samples of each at a time, two of x's elements converted together, then the floats taken apart.
    private static void Deinterleave(ReadOnlySpan<Vector128<double>> x, Span<float> a, Span<float> b)
    {
        var i = 0;
        if (Avx.IsSupported)
        {
            var d = MemoryMarshal.Cast<Vector128<double>, double>(x);
            for (; i + 4 <= x.Length; i += 4)
            {
                var low = Avx.ConvertToVector128Single(Vector256.Create(d.Slice(2 * i, 4)));
                var high = Avx.ConvertToVector128Single(Vector256.Create(d.Slice(2 * i + 4, 4)));
                // Lanes 0 and 2 of each are the first signal's, lanes 1 and 3 the second's.
                Sse.Shuffle(low, high, 0b10_00_10_00).CopyTo(a.Slice(i, 4));
                Sse.Shuffle(low, high, 0b11_01_11_01).CopyTo(b.Slice(i, 4));
            }
        }

        for (; i < x.Length; i++)
        {
            a[i] = (float)x[i].GetElement(0);
            b[i] = (float)x[i].GetElement(1);
        }
    }

    private Section Lanes(BiquadCascade other, int s) => new(
        Vector128.Create(_b0[s], other._b0[s]),
        Vector128.Create(_b1[s], other._b1[s]),
        Vector128.Create(_b2[s], other._b2[s]),
        Vector128.Create(_a1[s], other._a1[s]),
        Vector128.Create(_a2[s], other._a2[s]),
        Vector128.Create(_z1[s], other._z1[s]),
        Vector128.Create(_z2[s], other._z2[s]));

    private void Store(BiquadCascade other, int s, Vector128<double> z1, Vector128<double> z2)
    {
        _z1[s] = z1.GetElement(0);
        _z2[s] = z2.GetElement(0);
        other._z1[s] = z1.GetElement(1);
        other._z2[s] = z2.GetElement(1);
    }

    private void PairTwo(BiquadCascade other, Span<Vector128<double>> signal)
    {
        var p = Lanes(other, 0);
        var q = Lanes(other, 1);
        Vector128<double> u1 = p.Z1, u2 = p.Z2, v1 = q.Z1, v2 = q.Z2;
        for (var i = 0; i < signal.Length; i++)
        {
            var x = signal[i];
            var y = p.B0 * x + u1;
            u1 = p.B1 * x - p.A1 * y + u2;
            u2 = p.B2 * x - p.A2 * y;
            var z = q.B0 * y + v1;
            v1 = q.B1 * y - q.A1 * z + v2;
            v2 = q.B2 * y - q.A2 * z;
            signal[i] = z;
        }

        Store(other, 0, u1, u2);
        Store(other, 1, v1, v2);
    }

    private void PairThree(BiquadCascade other, Span<Vector128<double>> signal)
    {
        var p = Lanes(other, 0);
        var q = Lanes(other, 1);
        var r = Lanes(other, 2);
        Vector128<double> u1 = p.Z1, u2 = p.Z2, v1 = q.Z1, v2 = q.Z2, w1 = r.Z1, w2 = r.Z2;
        for (var i = 0; i < signal.Length; i++)
        {
            var x = signal[i];
            var y = p.B0 * x + u1;
            u1 = p.B1 * x - p.A1 * y + u2;
            u2 = p.B2 * x - p.A2 * y;
            var z = q.B0 * y + v1;
            v1 = q.B1 * y - q.A1 * z + v2;
            v2 = q.B2 * y - q.A2 * z;
            var o = r.B0 * z + w1;
            w1 = r.B1 * z - r.A1 * o + w2;
            w2 = r.B2 * z - r.A2 * o;
            signal[i] = o;
        }

        Store(other, 0, u1, u2);
        Store(other, 1, v1, v2);
        Store(other, 2, w1, w2);
    }

    // One section's coefficients and state, lane 0 for this cascade and lane 1 for the other.
    private readonly record struct Section(
        Vector128<double> B0, Vector128<double> B1, Vector128<double> B2, Vector128<double> A1, Vector128<double> A2,
        Vector128<double> Z1, Vector128<double> Z2);
}
