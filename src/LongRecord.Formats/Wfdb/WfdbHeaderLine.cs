namespace LongRecord.Formats.Wfdb;

/// <summary>One line of header text: its 1-based number, byte offset and content without the line end.</summary>
internal readonly record struct WfdbHeaderLine(int Number, int Offset, string Text)
{
    public static IEnumerable<WfdbHeaderLine> Split(string text)
    {
        var number = 0;
        var start = 0;
        while (start < text.Length)
        {
            number++;
            var end = text.IndexOf('\n', start);
            var next = end < 0 ? text.Length : end + 1;
            var stop = end < 0 ? text.Length : end;

            // header(5): a carriage return may precede each linefeed.
            if (stop > start && text[stop - 1] == '\r')
            {
                stop--;
            }

            yield return new WfdbHeaderLine(number, start, text[start..stop]);
            start = next;
        }
    }

    /// <summary>Splits the line into whitespace-separated fields; stops after <paramref name="max"/> fields.</summary>
    public List<WfdbField> Fields(int max = int.MaxValue)
    {
        var fields = new List<WfdbField>();
        var i = 0;
        while (i < Text.Length && fields.Count < max)
        {
            while (i < Text.Length && IsBlank(Text[i]))
            {
                i++;
            }

            if (i >= Text.Length)
            {
                break;
            }

            var s = i;
            while (i < Text.Length && !IsBlank(Text[i]))
            {
                i++;
            }

            fields.Add(new WfdbField(Offset + s, s, Text[s..i]));
        }

        return fields;
    }

    public static bool IsBlank(char c) => c is ' ' or '\t';
}

/// <summary>One whitespace-separated field: byte offset in the file, index in its line, and text.</summary>
internal readonly record struct WfdbField(int Offset, int IndexInLine, string Text);
