namespace LongRecord.Formats.Wfdb;

/// <summary>The format's own words (annotation(5)): codes above the largest annotation code.</summary>
internal static class WfdbMitWords
{
    public const int Skip = 59;
    public const int Num = 60;
    public const int Sub = 61;
    public const int Chn = 62;
    public const int Aux = 63;
}
