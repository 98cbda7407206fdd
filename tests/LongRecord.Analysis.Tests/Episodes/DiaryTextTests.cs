using LongRecord.Analysis.Episodes;

namespace LongRecord.Analysis.Tests.Episodes;

/// <summary>
/// The diary file <c>time,text</c> (episodes issue, item 6): times as seconds from the start or as an ISO 8601 local
/// date-time (extended format, ISO 8601-1:2019 §5.4), text fields quoted as RFC 4180 §2 allows. Expected values worked
/// by hand from those definitions.
/// </summary>
public sealed class DiaryTextTests
{
    private static readonly DateTime s_start = new(2026, 3, 4, 14, 0, 0);

    [Fact]
    public void Iso8601LocalDateTimeAndSeconds_GiveSecondsFromTheStart()
    {
        var parsed = DiaryText.Parse("time,text\n2026-03-04T15:30:00,palpitations\n90.5,button\n2026-03-05 00:00,woke up\n", s_start);

        Assert.Null(parsed.Problem);
        Assert.Equal(3, parsed.Events.Count);
        Assert.Equal(5400.0, parsed.Events[0].TimeS, 9);   // 15:30 − 14:00 = 1.5 h
        Assert.Equal("palpitations", parsed.Events[0].Text);
        Assert.Equal(90.5, parsed.Events[1].TimeS, 9);
        Assert.Equal(36000.0, parsed.Events[2].TimeS, 9);  // midnight − 14:00 = 10 h
        Assert.All(parsed.Events, e => Assert.Equal("diary", e.Source));
    }

    [Fact]
    public void Rfc4180QuotedField_KeepsItsCommaAndDoubledQuote()
    {
        var parsed = DiaryText.Parse("time,text\r\n12,\"dizzy, \"\"faint\"\"\"\r\n", s_start);

        Assert.Null(parsed.Problem);
        var e = Assert.Single(parsed.Events);
        Assert.Equal("dizzy, \"faint\"", e.Text);
    }

    [Fact]
    public void ClockTimeWithoutStartTime_IsAProblemAtItsLine()
    {
        // Line 2 begins after "time,text\n": 10 bytes.
        var parsed = DiaryText.Parse("time,text\n2026-03-04T15:30:00,x\n", start: null);

        Assert.NotNull(parsed.Problem);
        Assert.Equal(10, parsed.ByteOffset);
        Assert.Empty(parsed.Events);
    }

    [Fact]
    public void UnreadableTime_NamesTheLineByteOffset()
    {
        // Line 3 begins after "time,text\n" (10 bytes) and "5,ok\n" (5 bytes).
        var parsed = DiaryText.Parse("time,text\n5,ok\nlunchtime,ate\n", s_start);

        Assert.Contains("line 3", parsed.Problem);
        Assert.Equal(15, parsed.ByteOffset);
    }

    [Fact]
    public void WrongHeader_IsAProblemAtByteZero()
    {
        var parsed = DiaryText.Parse("when,what\n5,ok\n", s_start);

        Assert.NotNull(parsed.Problem);
        Assert.Equal(0, parsed.ByteOffset);
    }
}
