namespace LongRecord.Formats.Ishne;

/// <summary>One stored lead as the ISHNE header describes it.</summary>
/// <param name="Code">Lead specification (Table 1).</param>
/// <param name="ResolutionNv">Amplitude resolution: nanovolts per digital unit, positive.</param>
/// <param name="Quality">Lead quality (Table 2).</param>
public sealed record IshneLead(IshneLeadCode Code, short ResolutionNv, IshneLeadQuality Quality = IshneLeadQuality.Unknown)
{
    /// <summary>Display label for <paramref name="code"/>: "II", "V5", "X bipolar"; codes outside Table 1 give null.</summary>
    public static string? LabelOf(IshneLeadCode code) => code switch
    {
        IshneLeadCode.GenericBipolar => "generic bipolar",
        IshneLeadCode.XBipolar => "X bipolar",
        IshneLeadCode.YBipolar => "Y bipolar",
        IshneLeadCode.ZBipolar => "Z bipolar",
        IshneLeadCode.I => "I",
        IshneLeadCode.II => "II",
        IshneLeadCode.III => "III",
        IshneLeadCode.AVR => "aVR",
        IshneLeadCode.AVL => "aVL",
        IshneLeadCode.AVF => "aVF",
        IshneLeadCode.V1 => "V1",
        IshneLeadCode.V2 => "V2",
        IshneLeadCode.V3 => "V3",
        IshneLeadCode.V4 => "V4",
        IshneLeadCode.V5 => "V5",
        IshneLeadCode.V6 => "V6",
        IshneLeadCode.ES => "ES",
        IshneLeadCode.AS => "AS",
        IshneLeadCode.AI => "AI",
        _ => null,
    };
}
