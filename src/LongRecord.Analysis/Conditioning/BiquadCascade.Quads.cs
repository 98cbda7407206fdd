using System.Runtime.CompilerServices;
using System.Runtime.Intrinsics;
using System.Runtime.Intrinsics.X86;

namespace LongRecord.Analysis.Conditioning;

public sealed partial class BiquadCascade
{
    /// <summary>
    /// Filters any number of signals, lead-major in <paramref name="leadMajor"/> (signal k at k × <paramref name="count"/>),
    /// signal k through <paramref name="cascades"/>[k], in place, as many at a time as the vector lanes take: groups of
    /// four (<see cref="ProcessFour"/>), then the rest — three as four, two as a pair (<see cref="ProcessWith"/>), one
    /// alone. The same results, bit for bit, as each cascade's <c>Process</c> over its own signal.
    /// </summary>
    public static void ProcessLeads(ReadOnlySpan<BiquadCascade> cascades, Span<float> leadMajor, int count)
    {
        for (var k = 0; k < cascades.Length; k += 4)
        {
            var group = Math.Min(4, cascades.Length - k);
            var block = leadMajor.Slice(k * count, group * count);
            switch (group)
            {
                case 1:
                    cascades[k].Process(block);
                    break;
                case 2:
                    cascades[k].ProcessWith(cascades[k + 1], block[..count], block.Slice(count, count));
                    break;
                default:
                    ProcessFour(cascades.Slice(k, group), block, count);
                    break;
            }
        }
    }

    /// <summary>
    /// Filters three or four signals at once, lead-major in <paramref name="leadMajor"/> (signal k at k ×
    /// <paramref name="count"/>), signal k through <paramref name="cascades"/>[k], each in place. The same results, bit
    /// for bit, as each cascade's <c>Process</c> over its own signal.
    /// </summary>
    /// <remarks>
    /// The four lanes of one 256-bit vector share each section's chain of dependent multiply-adds, so three or four
    /// leads cost what two cost in <see cref="ProcessWith"/>. With three signals the fourth lane repeats the third (its
    /// coefficients, state and samples) and is never written back. Each lane does the scalar loop's operations in its
    /// order (no fused multiply-add), so the rounding is the same. The samples go into the lanes and back four at a time
    /// (a 4 × 4 transpose with one conversion per sample, outside the recursion): gathering them lane by lane inside the
    /// recursion made the three-lead conditioner 1.35× as fast as with a pair and a lone lead, against 1.7× this way
    /// (measured at 256 Hz). Where 256-bit vectors or AVX are not available, or the cascades have other than two or
    /// three sections, the signals go two at a time through <see cref="ProcessWith"/>.
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

        if (!Vector256.IsHardwareAccelerated || !Avx.IsSupported || sections is not (2 or 3))
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
        var work = cascades[0].LaneWork;
        for (var done = 0; done < count; done += WorkSamples)
        {
            var n = Math.Min(WorkSamples, count - done);
            var x = work[..n];
            var a = leadMajor.Slice(done, n);
            var b = leadMajor.Slice(count + done, n);
            var c = leadMajor.Slice(2 * count + done, n);
            var d = lanes == 4 ? leadMajor.Slice(3 * count + done, n) : c;
            Interleave(a, b, c, d, x);
            if (sections == 2)
            {
                QuadTwo(quad, x);
            }
            else
            {
                QuadThree(quad, x);
            }

            Deinterleave(x, a, b, c, d, writeFourth: lanes == 4);
        }
    }

    // Sample i of the four signals into the four lanes of x[i], widened to double (exact). Four samples at a time: a
    // 4 × 4 transpose of floats, then one conversion per sample.
    private static void Interleave(ReadOnlySpan<float> a, ReadOnlySpan<float> b, ReadOnlySpan<float> c, ReadOnlySpan<float> d, Span<Vector256<double>> x)
    {
        var i = 0;
        for (; i + 4 <= x.Length; i += 4)
        {
            var fa = Vector128.Create(a.Slice(i, 4));
            var fb = Vector128.Create(b.Slice(i, 4));
            var fc = Vector128.Create(c.Slice(i, 4));
            var fd = Vector128.Create(d.Slice(i, 4));
            var ab = Sse.UnpackLow(fa, fb);
            var ab2 = Sse.UnpackHigh(fa, fb);
            var cd = Sse.UnpackLow(fc, fd);
            var cd2 = Sse.UnpackHigh(fc, fd);
            x[i] = Avx.ConvertToVector256Double(Sse.MoveLowToHigh(ab, cd));
            x[i + 1] = Avx.ConvertToVector256Double(Sse.MoveHighToLow(cd, ab));
            x[i + 2] = Avx.ConvertToVector256Double(Sse.MoveLowToHigh(ab2, cd2));
            x[i + 3] = Avx.ConvertToVector256Double(Sse.MoveHighToLow(cd2, ab2));
        }

        for (; i < x.Length; i++)
        {
            x[i] = Vector256.Create(a[i], b[i], c[i], (double)d[i]);
        }
    }

    // The lanes of x back into the four signals, each rounded to the nearest float as a (float) cast rounds.
    private static void Deinterleave(ReadOnlySpan<Vector256<double>> x, Span<float> a, Span<float> b, Span<float> c, Span<float> d, bool writeFourth)
    {
        var i = 0;
        for (; i + 4 <= x.Length; i += 4)
        {
            var s0 = Avx.ConvertToVector128Single(x[i]);
            var s1 = Avx.ConvertToVector128Single(x[i + 1]);
            var s2 = Avx.ConvertToVector128Single(x[i + 2]);
            var s3 = Avx.ConvertToVector128Single(x[i + 3]);
            var ab = Sse.UnpackLow(s0, s1);
            var ab2 = Sse.UnpackLow(s2, s3);
            var cd = Sse.UnpackHigh(s0, s1);
            var cd2 = Sse.UnpackHigh(s2, s3);
            Sse.MoveLowToHigh(ab, ab2).CopyTo(a.Slice(i, 4));
            Sse.MoveHighToLow(ab2, ab).CopyTo(b.Slice(i, 4));
            Sse.MoveLowToHigh(cd, cd2).CopyTo(c.Slice(i, 4));
            if (writeFourth)
            {
                Sse.MoveHighToLow(cd2, cd).CopyTo(d.Slice(i, 4));
            }
        }

        for (; i < x.Length; i++)
        {
            a[i] = (float)x[i].GetElement(0);
            b[i] = (float)x[i].GetElement(1);
            c[i] = (float)x[i].GetElement(2);
            if (writeFourth)
            {
                d[i] = (float)x[i].GetElement(3);
            }
        }
    }

    private static void QuadTwo(Quad quad, Span<Vector256<double>> signal)
    {
        var p = quad.Lanes(0);
        var q = quad.Lanes(1);
        Vector256<double> u1 = p.Z1, u2 = p.Z2, v1 = q.Z1, v2 = q.Z2;
        for (var i = 0; i < signal.Length; i++)
        {
            signal[i] = q.Step(p.Step(signal[i], ref u1, ref u2), ref v1, ref v2);
        }

        quad.Store(0, u1, u2);
        quad.Store(1, v1, v2);
    }

    private static void QuadThree(Quad quad, Span<Vector256<double>> signal)
    {
        var p = quad.Lanes(0);
        var q = quad.Lanes(1);
        var r = quad.Lanes(2);
        Vector256<double> u1 = p.Z1, u2 = p.Z2, v1 = q.Z1, v2 = q.Z2, w1 = r.Z1, w2 = r.Z2;
        for (var i = 0; i < signal.Length; i++)
        {
            signal[i] = r.Step(q.Step(p.Step(signal[i], ref u1, ref u2), ref v1, ref v2), ref w1, ref w2);
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
        Vector256<double> Z1, Vector256<double> Z2)
    {
        // One sample through the section (transposed direct form II), in the scalar loop's order of operations.
        [MethodImpl(MethodImplOptions.AggressiveInlining)]
        public Vector256<double> Step(Vector256<double> x, ref Vector256<double> z1, ref Vector256<double> z2)
        {
            var y = B0 * x + z1;
            z1 = B1 * x - A1 * y + z2;
            z2 = B2 * x - A2 * y;
            return y;
        }
    }
}
