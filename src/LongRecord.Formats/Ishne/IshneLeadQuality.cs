namespace LongRecord.Formats.Ishne;

/// <summary>Lead quality codes of ISHNE 1.0 (Badilini 1998, Table 2).</summary>
public enum IshneLeadQuality : short
{
    Unknown = 0,
    Good = 1,

    /// <summary>Noise in less than 10 % of the recording.</summary>
    IntermittentNoise = 2,

    /// <summary>Noise in more than 10 % of the recording.</summary>
    FrequentNoise = 3,

    /// <summary>Lead disconnected in less than 10 % of the recording.</summary>
    IntermittentDisconnection = 4,

    /// <summary>Lead disconnected in more than 10 % of the recording.</summary>
    FrequentDisconnection = 5,
}
