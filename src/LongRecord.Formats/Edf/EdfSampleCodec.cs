using System.Buffers.Binary;
using System.Numerics;
using System.Runtime.InteropServices;

namespace LongRecord.Formats.Edf;

/// <summary>
/// Converts stored samples to physical values and back. EDF stores 16-bit and BDF 24-bit little-endian two's-complement
/// integers; value = <paramref name="scale"/> × digital + <paramref name="offset"/>, computed as one fused multiply-add
/// in float so vector and scalar paths give bit-identical results.
/// </summary>
internal static class EdfSampleCodec
{
    public static void Decode16(ReadOnlySpan<byte> source, Span<float> destination, float scale, float offset)
    {
        var n = destination.Length;
        var i = 0;
        if (BitConverter.IsLittleEndian)
        {
            var digital = MemoryMarshal.Cast<byte, short>(source)[..n];
            if (Vector.IsHardwareAccelerated && n >= Vector<short>.Count)
            {
                var a = new Vector<float>(scale);
                var b = new Vector<float>(offset);
                var step = Vector<short>.Count;
                var half = Vector<int>.Count;
                for (; i <= n - step; i += step)
                {
                    Vector.Widen(new Vector<short>(digital[i..]), out Vector<int> low, out Vector<int> high);
                    Vector.FusedMultiplyAdd(Vector.ConvertToSingle(low), a, b).CopyTo(destination[i..]);
                    Vector.FusedMultiplyAdd(Vector.ConvertToSingle(high), a, b).CopyTo(destination[(i + half)..]);
                }
            }

            for (; i < n; i++)
            {
                destination[i] = MathF.FusedMultiplyAdd(digital[i], scale, offset);
            }

            return;
        }

        for (; i < n; i++)
        {
            destination[i] = MathF.FusedMultiplyAdd(BinaryPrimitives.ReadInt16LittleEndian(source[(2 * i)..]), scale, offset);
        }
    }

    public static void Decode24(ReadOnlySpan<byte> source, Span<float> destination, float scale, float offset)
    {
        var n = destination.Length;
        source = source[..(3 * n)];
        for (var i = 0; i < n; i++)
        {
            var j = 3 * i;
            // The top byte is read as signed so the shift sign-extends the 24-bit value.
            var digital = source[j] | (source[j + 1] << 8) | ((sbyte)source[j + 2] << 16);
            destination[i] = MathF.FusedMultiplyAdd(digital, scale, offset);
        }
    }

    /// <summary>
    /// Quantises physical values: digital = round(<paramref name="gain"/> × value + <paramref name="baseline"/>), clamped
    /// to [<paramref name="digitalMin"/>, <paramref name="digitalMax"/>] (saturation). NaN is stored as the digital minimum.
    /// </summary>
    public static void Quantise(ReadOnlySpan<float> source, Span<int> destination, double gain, double baseline, int digitalMin, int digitalMax)
    {
        for (var i = 0; i < source.Length; i++)
        {
            var v = source[i];
            if (float.IsNaN(v))
            {
                destination[i] = digitalMin;
                continue;
            }

            var d = Math.Round(gain * v + baseline);
            destination[i] = d <= digitalMin ? digitalMin : d >= digitalMax ? digitalMax : (int)d;
        }
    }

    public static void Encode16(ReadOnlySpan<int> digital, Span<byte> destination)
    {
        for (var i = 0; i < digital.Length; i++)
        {
            BinaryPrimitives.WriteInt16LittleEndian(destination[(2 * i)..], (short)digital[i]);
        }
    }

    public static void Encode24(ReadOnlySpan<int> digital, Span<byte> destination)
    {
        for (var i = 0; i < digital.Length; i++)
        {
            var v = digital[i];
            var j = 3 * i;
            destination[j] = (byte)v;
            destination[j + 1] = (byte)(v >> 8);
            destination[j + 2] = (byte)(v >> 16);
        }
    }
}
