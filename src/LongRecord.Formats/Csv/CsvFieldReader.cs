namespace LongRecord.Formats.Csv;

/// <summary>Walks the fields of one data row in place; fields are trimmed of spaces (and tabs, unless tab separates).</summary>
internal ref struct CsvFieldReader
{
    private readonly ReadOnlySpan<byte> _line;
    private readonly byte _separator;
    private int _position;

    public CsvFieldReader(ReadOnlySpan<byte> line, char separator)
    {
        _line = line;
        _separator = (byte)separator;
        _position = 0;
        HasMore = true;
    }

    /// <summary>True while another field follows (the previous one ended at a separator).</summary>
    public bool HasMore { get; private set; }

    /// <summary>Returns the next field; <paramref name="start"/> is its index in the line, after trimming.</summary>
    public ReadOnlySpan<byte> Next(out int start)
    {
        var rest = _line[_position..];
        var end = rest.IndexOf(_separator);
        ReadOnlySpan<byte> field;
        start = _position;
        if (end < 0)
        {
            field = rest;
            _position = _line.Length;
            HasMore = false;
        }
        else
        {
            field = rest[..end];
            _position += end + 1;
        }

        while (field.Length > 0 && IsBlank(field[0]))
        {
            field = field[1..];
            start++;
        }

        while (field.Length > 0 && IsBlank(field[^1]))
        {
            field = field[..^1];
        }

        return field;
    }

    /// <summary>Skips <paramref name="count"/> fields; false when the row has fewer.</summary>
    public bool Skip(int count)
    {
        for (var i = 0; i < count; i++)
        {
            var end = _line[_position..].IndexOf(_separator);
            if (end < 0)
            {
                HasMore = false;
                _position = _line.Length;
                return false;
            }

            _position += end + 1;
        }

        return true;
    }

    private readonly bool IsBlank(byte b) => b == (byte)' ' || (b == (byte)'\t' && _separator != (byte)'\t');

    public static bool IsBlankLine(ReadOnlySpan<byte> line)
    {
        foreach (var b in line)
        {
            if (b != (byte)' ' && b != (byte)'\t')
            {
                return false;
            }
        }

        return true;
    }
}
