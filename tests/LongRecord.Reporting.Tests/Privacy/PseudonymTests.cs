using LongRecord.Pipeline.Privacy;
using LongRecord.TestSupport;

namespace LongRecord.Reporting.Tests.Privacy;

/// <summary>The pseudonym is HMAC-SHA-256 of the relative path under the key-file's key, checked against RFC 4231.</summary>
public sealed class PseudonymTests
{
    [Fact]
    public void Rfc4231TestCase1_FirstSixBytesOfTheMac()
    {
        // RFC 4231 §4.2: key = 0x0b × 20, data = "Hi There",
        // HMAC-SHA-256 = b0344c61d8db38535ca8afceaf0bf12b881dc200c9833da726e9376c2e32cff7.
        using var folder = new TempFolder("pseudonym");
        var key = folder.Write("key.json", System.Text.Encoding.UTF8.GetBytes($$"""{ "key": "{{Convert.ToBase64String(Enumerable.Repeat((byte)0x0b, 20).ToArray())}}" }"""));
        Assert.Equal("anon-b0344c61d8db", Pseudonyms.Open(key).For("Hi There"));
    }

    [Fact]
    public void NewKeyFile_IsCreated_AndGivesTheSamePseudonymWhenReopened()
    {
        using var folder = new TempFolder("pseudonym");
        var path = folder.Path("new-key.json");
        var first = Pseudonyms.Open(path).For("ward-3/patient.edf");
        Assert.True(File.Exists(path));
        Assert.Equal(first, Pseudonyms.Open(path).For("ward-3/patient.edf"));
        Assert.Equal(first, Pseudonyms.Open(path).For("ward-3\\patient.edf"));
        Assert.NotEqual(first, Pseudonyms.Open(path).For("ward-3/other.edf"));
    }

    [Fact]
    public void NotAKeyFile_IsRejectedNamingIt()
    {
        using var folder = new TempFolder("pseudonym");
        var path = folder.Write("notes.txt", "hello"u8.ToArray());
        var e = Assert.Throws<PseudonymKeyException>(() => Pseudonyms.Open(path));
        Assert.StartsWith(path + ": ", e.Message);
    }
}
