using System.Runtime.CompilerServices;
using System.Runtime.Intrinsics;

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
    /// are loaded and stored lane by lane inside the recursion. Moving them into and out of the lanes four at a time
    /// outside it, as <see cref="ProcessFour"/> does, was tried and not kept: 24 h of two leads at 250 Hz (best of 15,
    /// alternated) took 0.091–0.092 s against 0.094–0.096 s for the three-section conditioner cascade and
    /// 0.089–0.090 s against 0.088–0.089 s for the detector's two-section band-pass, and the beats stage did not
    /// change beyond its noise. The loads are not what this loop waits on: each sample waits on the previous one
    /// through a multiply and three additions in each section.
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

        var a = Work[..WorkSamples];
        var b = Work[WorkSamples..];
        for (var done = 0; done < first.Length; done += WorkSamples)
        {
            var n = Math.Min(WorkSamples, first.Length - done);
            var x = a[..n];
            var y = b[..n];
            Widen(first.Slice(done, n), x);
            Widen(second.Slice(done, n), y);
            if (Sections == 2)
            {
                PairTwo(other, x, y);
            }
            else
            {
                PairThree(other, x, y);
            }

            Narrow(x, first.Slice(done, n));
            Narrow(y, second.Slice(done, n));
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

    private void PairTwo(BiquadCascade other, Span<double> first, Span<double> second)
    {
        var p = Lanes(other, 0);
        var q = Lanes(other, 1);
        Vector128<double> u1 = p.Z1, u2 = p.Z2, v1 = q.Z1, v2 = q.Z2;
        for (var i = 0; i < first.Length; i++)
        {
            var z = q.Step(p.Step(Vector128.Create(first[i], second[i]), ref u1, ref u2), ref v1, ref v2);
            first[i] = z.GetElement(0);
            second[i] = z.GetElement(1);
        }

        Store(other, 0, u1, u2);
        Store(other, 1, v1, v2);
    }

    private void PairThree(BiquadCascade other, Span<double> first, Span<double> second)
    {
        var p = Lanes(other, 0);
        var q = Lanes(other, 1);
        var r = Lanes(other, 2);
        Vector128<double> u1 = p.Z1, u2 = p.Z2, v1 = q.Z1, v2 = q.Z2, w1 = r.Z1, w2 = r.Z2;
        for (var i = 0; i < first.Length; i++)
        {
            var o = r.Step(q.Step(p.Step(Vector128.Create(first[i], second[i]), ref u1, ref u2), ref v1, ref v2), ref w1, ref w2);
            first[i] = o.GetElement(0);
            second[i] = o.GetElement(1);
        }

        Store(other, 0, u1, u2);
        Store(other, 1, v1, v2);
        Store(other, 2, w1, w2);
    }

    // One section's coefficients and state, lane 0 for this cascade and lane 1 for the other.
    private readonly record struct Section(
        Vector128<double> B0, Vector128<double> B1, Vector128<double> B2, Vector128<double> A1, Vector128<double> A2,
        Vector128<double> Z1, Vector128<double> Z2)
    {
        // One sample through the section (transposed direct form II), in the scalar loop's order of operations.
        [MethodImpl(MethodImplOptions.AggressiveInlining)]
        public Vector128<double> Step(Vector128<double> x, ref Vector128<double> z1, ref Vector128<double> z2)
        {
            var y = B0 * x + z1;
            z1 = B1 * x - A1 * y + z2;
            z2 = B2 * x - A2 * y;
            return y;
        }
    }
}
