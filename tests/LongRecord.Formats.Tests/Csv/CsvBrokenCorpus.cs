using LongRecord.TestSupport;

namespace LongRecord.Formats.Tests.Csv;

/// <summary>
/// Damaged CSV recordings made from good text (<see cref="CsvTestText"/>, 250 Hz, two leads, times to 6 decimals). Line
/// numbers count from 1 with the header on line 1, so data row r is on line r + 2; offsets are computed from the text.
/// </summary>
public static class CsvBrokenCorpus
{
    private const int Rows = 400;

    public static IEnumerable<BrokenFile> Build()
    {
        // Row 100 onwards 0.8 ms late: one step of 4.8 ms, 20 % over the 4 ms interval.
        var jitter = CsvTestText.Seconds(250, Rows, time: i => i / 250.0 + (i >= 100 ? 0.0008 : 0));
        yield return Case("csv-jitter", jitter, "time step of 0.0048 s at line 102 deviates from the sampling interval", CsvTestText.OffsetOfLine(jitter, 102));

        var repeated = CsvTestText.Seconds(250, Rows, time: i => (i >= 50 ? i - 1 : i) / 250.0);
        yield return Case("csv-time-not-increasing", repeated, "time '0.196000' at line 52 is not later than the previous row's", CsvTestText.OffsetOfLine(repeated, 52));

        var good = CsvTestText.Seconds(250, Rows);
        var line22 = Line(good, 22);
        var lastComma = line22.LastIndexOf(',');
        var notNumber = ReplaceLine(good, 22, line22[..(lastComma + 1)] + "0.12x");
        yield return Case("csv-non-numeric-value", notNumber, "value '0.12x' in column 'L2 (mV)' at line 22 is not a number",
            CsvTestText.OffsetOfLine(notNumber, 22) + lastComma + 1);

        var shortRow = ReplaceLine(good, 32, line22[..lastComma].Replace("0.080000", "0.120000"));
        yield return Case("csv-ragged-row-short", shortRow, "line 32 has 2 fields, the header has 3", CsvTestText.OffsetOfLine(shortRow, 32));
        var longRow = ReplaceLine(good, 32, Line(good, 32) + ",0.5");
        yield return Case("csv-ragged-row-long", longRow, "line 32 has 4 fields, the header has 3", CsvTestText.OffsetOfLine(longRow, 32));

        var headerOnly = "# Brackenfield demo\ntime_s,L1 (mV),L2 (mV)\n";
        yield return Case("csv-header-only", headerOnly, "no data rows after the header", headerOnly.Length);
        var oneRow = "time_s,L1 (mV)\n0.000,0.5\n";
        yield return Case("csv-single-row", oneRow, "only one data row (line 2): two or more are needed", CsvTestText.OffsetOfLine(oneRow, 2));

        var clock = "time,L1\n08:15:00.000,0.1\n08:15:00.004,0.2\n";
        yield return Case("csv-unknown-time-format", clock, "unknown time format '08:15:00.000' at line 2", CsvTestText.OffsetOfLine(clock, 2));
        var mixedTime = "time,L1\n2026-03-04T08:15:00.000,0.1\n0.004,0.2\n";
        yield return Case("csv-iso-then-seconds", mixedTime, "time '0.004' at line 3 is not an ISO 8601 date-time like the first row's", CsvTestText.OffsetOfLine(mixedTime, 3));

        yield return Case("csv-first-column-not-time", "# x\nname,L1\n0,1\n1,2\n", "first header column 'name' is not a time column", 4);
        yield return Case("csv-mixed-separators", "time,L1;L2\n0,1;2\n", "mixes separators ',' and ';'", 0);
        yield return Case("csv-single-column", "time\n0\n1\n", "header 'time' has one column", 0);
        yield return Case("csv-time-unit-ms", "time (ms),L1\n0,1\n4,2\n", "time column unit 'ms' is not supported", 0);
        yield return Case("csv-empty-file", "", "no header row", 0);

        var decimalComma = "time;L1\n0;0,5\n0,004;0,6\n";
        yield return Case("csv-decimal-comma", decimalComma, "value '0,5' in column 'L1' at line 2 is not a number (decimal comma", 10);

        var badStart = "# start: 4 March 2026\ntime_s,L1\n0,1\n1,2\n";
        yield return Case("csv-start-comment-not-a-date", badStart, "start comment '4 March 2026' at line 1 is not an ISO 8601 date-time", 0);
        var disagree = "# start: 2026-03-04T09:00:00\ntime,L1\n2026-03-04T08:15:00.000,0.1\n2026-03-04T08:15:00.004,0.2\n";
        yield return Case("csv-start-comment-disagrees", disagree, "start comment at line 1 disagrees with the first row's time 2026-03-04T08:15:00", 0);
    }

    private static BrokenFile Case(string name, string text, string problem, long? offset) =>
        new(name, name + ".csv", CsvTestText.Bytes(text), problem, offset);

    private static string Line(string text, int line) => text.Split('\n')[line - 1];

    private static string ReplaceLine(string text, int line, string replacement)
    {
        var lines = text.Split('\n');
        lines[line - 1] = replacement;
        return string.Join('\n', lines);
    }
}
