namespace LongRecord.Formats.Tests.Wfdb;

/// <summary>
/// Writes a stream of stored values (frame after frame) in each signal(5) format, written out from the format's
/// description and independent of the reader's decoder.
/// </summary>
internal static class WfdbHandEncoder
{
    /// <summary>Encodes <paramref name="stream"/>; for format 8, <paramref name="signalOfSlot"/> and
    /// <paramref name="initial"/> give each value's signal and the signals' initial values.</summary>
    public static byte[] Encode(int format, int[] stream, int[]? signalOfSlot = null, int[]? initial = null)
    {
        var bytes = new List<byte>();
        switch (format)
        {
            case 8:
                // First differences per signal, the first against the header's initial value.
                var previous = (int[])initial!.Clone();
                for (var i = 0; i < stream.Length; i++)
                {
                    var s = signalOfSlot![i % signalOfSlot.Length];
                    var d = stream[i] - previous[s];
                    if (d is < -128 or > 127)
                    {
                        throw new ArgumentException("difference does not fit in 8 bits");
                    }

                    bytes.Add(unchecked((byte)(sbyte)d));
                    previous[s] = stream[i];
                }

                break;
            case 16:
                foreach (var v in stream)
                {
                    bytes.Add((byte)(v & 0xFF));
                    bytes.Add((byte)((v >> 8) & 0xFF));
                }

                break;
            case 61:
                foreach (var v in stream)
                {
                    bytes.Add((byte)((v >> 8) & 0xFF));
                    bytes.Add((byte)(v & 0xFF));
                }

                break;
            case 80:
                foreach (var v in stream)
                {
                    bytes.Add((byte)(v + 128));
                }

                break;
            case 160:
                foreach (var v in stream)
                {
                    var u = v + 32768;
                    bytes.Add((byte)(u % 256));
                    bytes.Add((byte)(u / 256));
                }

                break;
            case 24:
                foreach (var v in stream)
                {
                    var u = v < 0 ? v + (1 << 24) : v;
                    bytes.Add((byte)(u % 256));
                    bytes.Add((byte)(u / 256 % 256));
                    bytes.Add((byte)(u / 65536));
                }

                break;
            case 32:
                foreach (var v in stream)
                {
                    bytes.AddRange(BitConverter.GetBytes(v));
                }

                break;
            case 212:
                for (var i = 0; i < stream.Length; i += 2)
                {
                    var a = stream[i] < 0 ? stream[i] + 4096 : stream[i];
                    var b = i + 1 < stream.Length ? (stream[i + 1] < 0 ? stream[i + 1] + 4096 : stream[i + 1]) : 0;
                    bytes.Add((byte)(a % 256));
                    bytes.Add((byte)(a / 256 + 16 * (b / 256)));
                    if (i + 1 < stream.Length)
                    {
                        bytes.Add((byte)(b % 256));
                    }
                }

                break;
            case 310:
                for (var i = 0; i < stream.Length; i += 3)
                {
                    int U(int k) => k < stream.Length ? (stream[k] < 0 ? stream[k] + 1024 : stream[k]) : 0;
                    var (a, b, c) = (U(i), U(i + 1), U(i + 2));
                    var w0 = 2 * a + 2048 * (c % 32);
                    var w1 = 2 * b + 2048 * (c / 32);
                    bytes.Add((byte)(w0 % 256));
                    bytes.Add((byte)(w0 / 256));
                    if (i + 1 < stream.Length)
                    {
                        bytes.Add((byte)(w1 % 256));
                        bytes.Add((byte)(w1 / 256));
                    }
                }

                break;
            case 311:
                for (var i = 0; i < stream.Length; i += 3)
                {
                    long U(int k) => k < stream.Length ? (stream[k] < 0 ? stream[k] + 1024 : stream[k]) : 0;
                    var w = U(i) + 1024 * U(i + 1) + 1024L * 1024 * U(i + 2);
                    var kept = i + 2 < stream.Length ? 4 : i + 1 < stream.Length ? 3 : 2;
                    for (var k = 0; k < kept; k++)
                    {
                        bytes.Add((byte)(w >> (8 * k)));
                    }
                }

                break;
            default:
                throw new ArgumentOutOfRangeException(nameof(format));
        }

        return [.. bytes];
    }
}
