using System.Security.Cryptography;

namespace LongRecord.Pipeline.Batch;

/// <summary>SHA-256 of a file's content, read in large blocks through a read-only handle.</summary>
public static class ContentHash
{
    // 1 MiB: large enough that the hash, not the system calls, sets the pace (common practice, no source).
    private const int BlockBytes = 1 << 20;

    /// <summary>Lower-case hex SHA-256 of the whole file and its length in bytes.</summary>
    public static (string Sha256, long Bytes) Of(string path)
    {
        using var handle = File.OpenHandle(path, FileMode.Open, FileAccess.Read, FileShare.Read, FileOptions.SequentialScan);
        using var hash = IncrementalHash.CreateHash(HashAlgorithmName.SHA256);
        var buffer = System.Buffers.ArrayPool<byte>.Shared.Rent(BlockBytes);
        try
        {
            long offset = 0;
            int read;
            while ((read = RandomAccess.Read(handle, buffer.AsSpan(0, BlockBytes), offset)) > 0)
            {
                hash.AppendData(buffer, 0, read);
                offset += read;
            }

            return (Convert.ToHexStringLower(hash.GetHashAndReset()), offset);
        }
        finally
        {
            System.Buffers.ArrayPool<byte>.Shared.Return(buffer);
        }
    }
}
