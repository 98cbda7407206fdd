namespace LongRecord.Formats.Ishne;

/// <summary>Subject sex codes of the ISHNE 1.0 header (Badilini 1998, Table 3).</summary>
public enum IshneSex : short
{
    Unknown = 0,
    Male = 1,
    Female = 2,
}
