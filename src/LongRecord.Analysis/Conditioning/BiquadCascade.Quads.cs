using System.Runtime.Intrinsics;

namespace LongRecord.Analysis.Conditioning;

public sealed partial class BiquadCascade
{
    /// <summary>
    /// Filters three or four signals at once, lead-major in <paramref name="leadMajor"/> (signal k at k ×
    /// <paramref name="count"/>), signal k through <paramref name="cascades"/>[k], each in place. The same results, bit
    /// for bit, as each cascade's <c>Process</c> over its own signal.
    /// </summary>
    /// <remarks>
    /// The four lanes of one 256-bit vector share each section's chain of dependent multiply-adds, so three or four
    /// leads cost what two cost in <see cref="ProcessWith"/>. With three signals the fourth lane repeats the third (its
    /// coefficients, state and samples) and is never written back. Each lane does the scalar loop's operations in its
    /// order (no fused multiply-add), so the rounding is the same. Where 256-bit vectors are not accelerated, or the
    /// cascades have other than two or three sections, the signals go two at a time through <see cref="ProcessWith"/>.
    /// </remarks>
    public static void ProcessFour(ReadOnlySpan<BiquadCascade> cascades, Span<float> leadMajor, int count)
    {
        var lanes = cascades.Length;
        if (lanes is not (3 or 4))
        {
            throw new ArgumentException($"three or four cascades are needed, not {lanes}", nameof(cascades));
        }

        ArgumentOutOfRangeException.ThrowIfNegative(count);
        if (leadMajor.Length < lanes * count)
        {
            throw new ArgumentException($"the block needs {lanes} × {count} samples", nameof(leadMajor));
        }

        var sections = cascades[0].Sections;
        for (var k = 1; k < lanes; k++)
        {
            if (cascades[k].Sections != sections)
            {
                throw new ArgumentException($"the cascades differ in sections ({sections} and {cascades[k].Sections})", nameof(cascades));
            }
        }

        if (!Vector256.IsHardwareAccelerated || sections is not (2 or 3))
        {
            cascades[0].ProcessWith(cascades[1], leadMajor[..count], leadMajor.Slice(count, count));
            if (lanes == 4)
            {
                cascades[2].ProcessWith(cascades[3], leadMajor.Slice(2 * count, count), leadMajor.Slice(3 * count, count));
            }
            else
            {
                cascades[2].Process(leadMajor.Slice(2 * count, count));
            }

            return;
        }

        var quad = new Quad(cascades[0], cascades[1], cascades[2], cascades[lanes - 1], lanes);
        Span<double> work = stackalloc double[4 * WorkSamples];
        for (var done = 0; done < count; done += WorkSamples)
        {
            var n = Math.Min(WorkSamples, count - done);
            var a = work[..n];
            var b = work.Slice(WorkSamples, n);
            var c = work.Slice(2 * WorkSamples, n);
            var d = work.Slice(3 * WorkSamples, n);
            Widen(leadMajor.Slice(done, n), a);
            Widen(leadMajor.Slice(count + done, n), b);
            Widen(leadMajor.Slice(2 * count + done, n), c);
            if (lanes == 4)
            {
                Widen(leadMajor.Slice(3 * count + done, n), d);
            }
            else
            {
                c.CopyTo(d);
            }

            if (sections == 2)
            {
                QuadTwo(quad, a, b, c, d);
            }
            else
            {
                QuadThree(quad, a, b, c, d);
            }

            Narrow(a, leadMajor.Slice(done, n));
            Narrow(b, leadMajor.Slice(count + done, n));
            Narrow(c, leadMajor.Slice(2 * count + done, n));
            if (lanes == 4)
            {
                Narrow(d, leadMajor.Slice(3 * count + done, n));
            }
        }
    }

    private static void QuadTwo(Quad quad, Span<double> a, Span<double> b, Span<double> c, Span<double> d)
    {
        var p = quad.Lanes(0);
        var q = quad.Lanes(1);
        Vector256<double> u1 = p.Z1, u2 = p.Z2, v1 = q.Z1, v2 = q.Z2;
        for (var i = 0; i < a.Length; i++)
        {
            var x = Vector256.Create(a[i], b[i], c[i], d[i]);
            var y = p.B0 * x + u1;
            u1 = p.B1 * x - p.A1 * y + u2;
            u2 = p.B2 * x - p.A2 * y;
            var z = q.B0 * y + v1;
            v1 = q.B1 * y - q.A1 * z + v2;
            v2 = q.B2 * y - q.A2 * z;
            a[i] = z.GetElement(0);
            b[i] = z.GetElement(1);
            c[i] = z.GetElement(2);
            d[i] = z.GetElement(3);
        }

        quad.Store(0, u1, u2);
        quad.Store(1, v1, v2);
    }

    private static void QuadThree(Quad quad, Span<double> a, Span<double> b, Span<double> c, Span<double> d)
    {
        var p = quad.Lanes(0);
        var q = quad.Lanes(1);
        var r = quad.Lanes(2);
        Vector256<double> u1 = p.Z1, u2 = p.Z2, v1 = q.Z1, v2 = q.Z2, w1 = r.Z1, w2 = r.Z2;
        for (var i = 0; i < a.Length; i++)
        {
            var x = Vector256.Create(a[i], b[i], c[i], d[i]);
            var y = p.B0 * x + u1;
            u1 = p.B1 * x - p.A1 * y + u2;
            u2 = p.B2 * x - p.A2 * y;
            var z = q.B0 * y + v1;
            v1 = q.B1 * y - q.A1 * z + v2;
            v2 = q.B2 * y - q.A2 * z;
            var o = r.B0 * z + w1;
            w1 = r.B1 * z - r.A1 * o + w2;
            w2 = r.B2 * z - r.A2 * o;
            a[i] = o.GetElement(0);
            b[i] = o.GetElement(1);
            c[i] = o.GetElement(2);
            d[i] = o.GetElement(3);
        }

        quad.Store(0, u1, u2);
        quad.Store(1, v1, v2);
        quad.Store(2, w1, w2);
    }

    // Four cascades in the four lanes; with three, the fourth is the third again and is not written back.
    private readonly record struct Quad(BiquadCascade First, BiquadCascade Second, BiquadCascade Third, BiquadCascade Fourth, int Count)
    {
        public QuadSection Lanes(int s) => new(
            Vector256.Create(First._b0[s], Second._b0[s], Third._b0[s], Fourth._b0[s]),
            Vector256.Create(First._b1[s], Second._b1[s], Third._b1[s], Fourth._b1[s]),
            Vector256.Create(First._b2[s], Second._b2[s], Third._b2[s], Fourth._b2[s]),
            Vector256.Create(First._a1[s], Second._a1[s], Third._a1[s], Fourth._a1[s]),
            Vector256.Create(First._a2[s], Second._a2[s], Third._a2[s], Fourth._a2[s]),
            Vector256.Create(First._z1[s], Second._z1[s], Third._z1[s], Fourth._z1[s]),
            Vector256.Create(First._z2[s], Second._z2[s], Third._z2[s], Fourth._z2[s]));

        public void Store(int s, Vector256<double> z1, Vector256<double> z2)
        {
            First._z1[s] = z1.GetElement(0);
            First._z2[s] = z2.GetElement(0);
            Second._z1[s] = z1.GetElement(1);
            Second._z2[s] = z2.GetElement(1);
            Third._z1[s] = z1.GetElement(2);
            Third._z2[s] = z2.GetElement(2);
            if (Count == 4)
            {
                Fourth._z1[s] = z1.GetElement(3);
                Fourth._z2[s] = z2.GetElement(3);
            }
        }
    }

    // One section's coefficients and state across the four lanes.
    private readonly record struct QuadSection(
        Vector256<double> B0, Vector256<double> B1, Vector256<double> B2, Vector256<double> A1, Vector256<double> A2,
        Vector256<double> Z1, Vector256<double> Z2);
}
