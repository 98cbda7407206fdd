using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;
using System.Runtime.Intrinsics;
using System.Runtime.Intrinsics.X86;
using NWaves.Filters.Fda;

namespace LongRecord.Analysis.Beats.Delineation;

/// <summary>
/// A second-order Butterworth low-pass (designed by NWaves, run by our own loop) applied forward and then backward over
/// a short stretch: zero phase, so wave boundaries do not move; the magnitude response is squared (−6 dB at the
/// corner). Each pass starts in the steady state of its first input value, so nothing passes between windows.
/// </summary>
internal sealed class ZeroPhaseLowPass
{
    private readonly double _b0;
    private readonly double _b1;
    private readonly double _b2;
    private readonly double _a1;
    private readonly double _a2;
    private readonly double _gain;

    public ZeroPhaseLowPass(double cornerHz, double samplingRateHz)
    {
        // NWaves takes the corner divided by the sampling rate; keep it below Nyquist for slow recordings.
        var normalised = Math.Min(cornerHz, 0.45 * samplingRateHz) / samplingRateHz;
        var sections = DesignFilter.TfToSos(new NWaves.Filters.Butterworth.LowPassFilter(normalised, 2).Tf);
        var b = sections[0].Numerator;
        var a = sections[0].Denominator;
        _b0 = b[0] / a[0];
        _b1 = (b.Length > 1 ? b[1] : 0) / a[0];
        _b2 = (b.Length > 2 ? b[2] : 0) / a[0];
        _a1 = (a.Length > 1 ? a[1] : 0) / a[0];
        _a2 = (a.Length > 2 ? a[2] : 0) / a[0];
        _gain = (_b0 + _b1 + _b2) / (1 + _a1 + _a2);
    }

    /// <summary>
    /// Filters the lanes (up to four stretches of one length, each with its own filter) forward and backward.
    /// <paramref name="work"/> holds at least 4 × the length. With 256-bit vectors the four recursions run in the lanes
    /// of one vector, else one after another; each lane sees the same operations in the same order either way, so the
    /// result does not depend on the processor.
    /// </summary>
    public static void Run(ref FilterLanes lanes, Span<double> work)
    {
        var n = lanes.Length;
        if (n == 0 || lanes.Count == 0)
        {
            return;
        }

        if (work.Length < 4 * n)
        {
            throw new ArgumentException("the work buffer holds fewer than 4 × length values", nameof(work));
        }

        if (Vector256.IsHardwareAccelerated)
        {
            RunVector(ref lanes, work, n);
        }
        else
        {
            RunLaneByLane(ref lanes, work);
        }
    }

    /// <summary>The lanes one after another, without vectors (what <see cref="Run"/> does on a processor without them).</summary>
    internal static void RunLaneByLane(ref FilterLanes lanes, Span<double> work)
    {
        for (var k = 0; k < lanes.Count; k++)
        {
            lanes.Filter(k).RunScalar(lanes.Source(k), lanes.Destination(k), work);
        }
    }

    // Direct form I: the feedback of the last output is added last, so one multiply-add lies on the recursion's
    // critical path (the transposed form has two). The forward pass reads the four sources side by side and keeps its
    // output in the work buffer (one vector per sample); the backward pass writes the four destinations.
    private static void RunVector(ref FilterLanes lanes, Span<double> work, int n)
    {
        var count = lanes.Count;
        var f0 = lanes.Filter(0);
        var f1 = count > 1 ? lanes.Filter(1) : f0;
        var f2 = count > 2 ? lanes.Filter(2) : f0;
        var f3 = count > 3 ? lanes.Filter(3) : f0;
        var b0 = Vector256.Create(f0._b0, f1._b0, f2._b0, f3._b0);
        var b1 = Vector256.Create(f0._b1, f1._b1, f2._b1, f3._b1);
        var b2 = Vector256.Create(f0._b2, f1._b2, f2._b2, f3._b2);
        var minusA1 = Vector256.Create(-f0._a1, -f1._a1, -f2._a1, -f3._a1);
        var a2 = Vector256.Create(f0._a2, f1._a2, f2._a2, f3._a2);
        var gain = Vector256.Create(f0._gain, f1._gain, f2._gain, f3._gain);

        // A missing lane repeats lane 0; its output is never written.
        ref var s0 = ref MemoryMarshal.GetReference(lanes.Source(0));
        ref var s1 = ref MemoryMarshal.GetReference(count > 1 ? lanes.Source(1) : lanes.Source(0));
        ref var s2 = ref MemoryMarshal.GetReference(count > 2 ? lanes.Source(2) : lanes.Source(0));
        ref var s3 = ref MemoryMarshal.GetReference(count > 3 ? lanes.Source(3) : lanes.Source(0));
        ref var w = ref MemoryMarshal.GetReference(work);

        var u = Vector256.Create((double)s0, s1, s2, s3);
        Vector256<double> u1 = u, u2 = u, y1 = gain * u, y2 = y1;
        nuint i = 0;
        if (Avx.IsSupported)
        {
            // Four samples of the four sources at a time, turned into four vectors of one sample each (a 4 × 4
            // transpose); widening to double is exact, so each lane sees the values the one-by-one loads give.
            for (; i + 4 <= (nuint)n; i += 4)
            {
                Transpose(
                    Vector128.LoadUnsafe(ref s0, i), Vector128.LoadUnsafe(ref s1, i), Vector128.LoadUnsafe(ref s2, i), Vector128.LoadUnsafe(ref s3, i),
                    out var c0, out var c1, out var c2, out var c3);
                Step(Avx.ConvertToVector256Double(c0), ref u1, ref u2, ref y1, ref y2, b0, b1, b2, minusA1, a2).StoreUnsafe(ref w, 4 * i);
                Step(Avx.ConvertToVector256Double(c1), ref u1, ref u2, ref y1, ref y2, b0, b1, b2, minusA1, a2).StoreUnsafe(ref w, 4 * (i + 1));
                Step(Avx.ConvertToVector256Double(c2), ref u1, ref u2, ref y1, ref y2, b0, b1, b2, minusA1, a2).StoreUnsafe(ref w, 4 * (i + 2));
                Step(Avx.ConvertToVector256Double(c3), ref u1, ref u2, ref y1, ref y2, b0, b1, b2, minusA1, a2).StoreUnsafe(ref w, 4 * (i + 3));
            }
        }

        for (; i < (nuint)n; i++)
        {
            u = Vector256.Create((double)Unsafe.Add(ref s0, i), Unsafe.Add(ref s1, i), Unsafe.Add(ref s2, i), Unsafe.Add(ref s3, i));
            Step(u, ref u1, ref u2, ref y1, ref y2, b0, b1, b2, minusA1, a2).StoreUnsafe(ref w, 4 * i);
        }

        Span<float> none = stackalloc float[1];
        ref var d0 = ref MemoryMarshal.GetReference(lanes.Destination(0));
        ref var d1 = ref MemoryMarshal.GetReference(count > 1 ? lanes.Destination(1) : none);
        ref var d2 = ref MemoryMarshal.GetReference(count > 2 ? lanes.Destination(2) : none);
        ref var d3 = ref MemoryMarshal.GetReference(count > 3 ? lanes.Destination(3) : none);
        u = Vector256.LoadUnsafe(ref w, 4 * (nuint)(n - 1));
        u1 = u;
        u2 = u;
        y1 = gain * u;
        y2 = y1;
        var j = n - 1;
        if (Avx.IsSupported)
        {
            // Four outputs at a time, narrowed to float (rounded to nearest, as the cast rounds) and turned back
            // into four samples of each destination.
            for (; j >= 3; j -= 4)
            {
                var ya = Step(Vector256.LoadUnsafe(ref w, 4 * (nuint)j), ref u1, ref u2, ref y1, ref y2, b0, b1, b2, minusA1, a2);
                var yb = Step(Vector256.LoadUnsafe(ref w, 4 * (nuint)(j - 1)), ref u1, ref u2, ref y1, ref y2, b0, b1, b2, minusA1, a2);
                var yc = Step(Vector256.LoadUnsafe(ref w, 4 * (nuint)(j - 2)), ref u1, ref u2, ref y1, ref y2, b0, b1, b2, minusA1, a2);
                var yd = Step(Vector256.LoadUnsafe(ref w, 4 * (nuint)(j - 3)), ref u1, ref u2, ref y1, ref y2, b0, b1, b2, minusA1, a2);
                Transpose(
                    Avx.ConvertToVector128Single(yd), Avx.ConvertToVector128Single(yc), Avx.ConvertToVector128Single(yb), Avx.ConvertToVector128Single(ya),
                    out var c0, out var c1, out var c2, out var c3);
                var at = (nuint)(j - 3);
                c0.StoreUnsafe(ref d0, at);
                if (count > 1)
                {
                    c1.StoreUnsafe(ref d1, at);
                    if (count > 2)
                    {
                        c2.StoreUnsafe(ref d2, at);
                        if (count > 3)
                        {
                            c3.StoreUnsafe(ref d3, at);
                        }
                    }
                }
            }
        }

        for (; j >= 0; j--)
        {
            u = Vector256.LoadUnsafe(ref w, 4 * (nuint)j);
            var y = Step(u, ref u1, ref u2, ref y1, ref y2, b0, b1, b2, minusA1, a2);
            Unsafe.Add(ref d0, j) = (float)y.GetElement(0);
            if (count > 1)
            {
                Unsafe.Add(ref d1, j) = (float)y.GetElement(1);
                if (count > 2)
                {
                    Unsafe.Add(ref d2, j) = (float)y.GetElement(2);
                    if (count > 3)
                    {
                        Unsafe.Add(ref d3, j) = (float)y.GetElement(3);
                    }
                }
            }
        }
    }

    // One step of the recursion in every lane: y = b0·u + b1·u1 + b2·u2 − a2·y2, then − a1·y1 fused last.
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static Vector256<double> Step(
        Vector256<double> u, ref Vector256<double> u1, ref Vector256<double> u2, ref Vector256<double> y1, ref Vector256<double> y2,
        Vector256<double> b0, Vector256<double> b1, Vector256<double> b2, Vector256<double> minusA1, Vector256<double> a2)
    {
        var y = Vector256.FusedMultiplyAdd(minusA1, y1, b0 * u + b1 * u1 + b2 * u2 - a2 * y2);
        u2 = u1;
        u1 = u;
        y2 = y1;
        y1 = y;
        return y;
    }

    // Rows r0..r3 into columns c0..c3 (c_k holds element k of every row).
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static void Transpose(
        Vector128<float> r0, Vector128<float> r1, Vector128<float> r2, Vector128<float> r3,
        out Vector128<float> c0, out Vector128<float> c1, out Vector128<float> c2, out Vector128<float> c3)
    {
        var t0 = Sse.UnpackLow(r0, r1);
        var t1 = Sse.UnpackLow(r2, r3);
        var t2 = Sse.UnpackHigh(r0, r1);
        var t3 = Sse.UnpackHigh(r2, r3);
        c0 = Sse.MoveLowToHigh(t0, t1);
        c1 = Sse.MoveHighToLow(t1, t0);
        c2 = Sse.MoveLowToHigh(t2, t3);
        c3 = Sse.MoveHighToLow(t3, t2);
    }

    // One lane, forward then backward, with the vector loop's arithmetic.
    private void RunScalar(ReadOnlySpan<float> source, Span<float> destination, Span<double> work)
    {
        double b0 = _b0, b1 = _b1, b2 = _b2, minusA1 = -_a1, a2 = _a2;
        var n = source.Length;
        double u = source[0];
        double u1 = u, u2 = u, y1 = _gain * u, y2 = y1;
        for (var i = 0; i < n; i++)
        {
            u = source[i];
            var y = Math.FusedMultiplyAdd(minusA1, y1, b0 * u + b1 * u1 + b2 * u2 - a2 * y2);
            u2 = u1;
            u1 = u;
            y2 = y1;
            y1 = y;
            work[i] = y;
        }

        u = work[n - 1];
        u1 = u;
        u2 = u;
        y1 = _gain * u;
        y2 = y1;
        for (var i = n - 1; i >= 0; i--)
        {
            u = work[i];
            var y = Math.FusedMultiplyAdd(minusA1, y1, b0 * u + b1 * u1 + b2 * u2 - a2 * y2);
            u2 = u1;
            u1 = u;
            y2 = y1;
            y1 = y;
            destination[i] = (float)y;
        }
    }
}
