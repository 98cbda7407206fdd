using Microsoft.Win32.SafeHandles;

namespace LongRecord.Formats.IO;

/// <summary>
/// A file opened read-only for positioned reads (no shared seek state). Short reads become a
/// <see cref="RecordingFormatException"/> naming the file and the byte where data ran out.
/// </summary>
public sealed class ReadOnlyRecordingFile : IDisposable
{
    private readonly SafeFileHandle _handle;

    private ReadOnlyRecordingFile(string path, SafeFileHandle handle, long length)
    {
        Path = path;
        _handle = handle;
        Length = length;
    }

    public string Path { get; }

    public long Length { get; }

    /// <summary>Opens <paramref name="path"/> for reading only; a missing or unreadable file is a <see cref="RecordingFormatException"/>.</summary>
    public static ReadOnlyRecordingFile Open(string path)
    {
        try
        {
            var handle = File.OpenHandle(path, FileMode.Open, FileAccess.Read, FileShare.Read, FileOptions.RandomAccess);
            return new ReadOnlyRecordingFile(path, handle, RandomAccess.GetLength(handle));
        }
        catch (FileNotFoundException)
        {
            throw new RecordingFormatException(path, "file not found");
        }
        catch (DirectoryNotFoundException)
        {
            throw new RecordingFormatException(path, "file not found");
        }
        catch (UnauthorizedAccessException)
        {
            throw new RecordingFormatException(path, "permission denied");
        }
        catch (IOException e)
        {
            throw new RecordingFormatException(path, $"cannot open: {e.Message}");
        }
    }

    /// <summary>Reads exactly <paramref name="destination"/>.Length bytes at <paramref name="offset"/>, or throws.</summary>
    /// <param name="what">What the bytes are, for the error message (for example <c>data record 12</c>).</param>
    public void ReadExactly(long offset, Span<byte> destination, string what)
    {
        var done = 0;
        while (done < destination.Length)
        {
            var n = RandomAccess.Read(_handle, destination[done..], offset + done);
            if (n == 0)
            {
                RecordingFormatException.Throw(Path, FormattableString.Invariant($"file ends inside {what} (needs {destination.Length} bytes, has {done})"), offset + done);
            }

            done += n;
        }
    }

    /// <summary>Reads up to <paramref name="destination"/>.Length bytes at <paramref name="offset"/>; returns how many were read.</summary>
    public int ReadAtMost(long offset, Span<byte> destination)
    {
        var done = 0;
        while (done < destination.Length)
        {
            var n = RandomAccess.Read(_handle, destination[done..], offset + done);
            if (n == 0)
            {
                break;
            }

            done += n;
        }

        return done;
    }

    public void Dispose() => _handle.Dispose();
}
