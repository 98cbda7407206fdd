namespace LongRecord.Formats.Wfdb;

/// <summary>
/// Standard annotation codes of the MIT annotation format. Values are those of the WFDB library's
/// <c>ecgcodes.h</c> (bemoody/wfdb, lib/ecgcodes.h, "Last revised 29 April 1999"); the names are our own. Codes 42–49
/// are user-defined (ACMAX = 49); 15 and 17 are unassigned. Mnemonics are in <see cref="WfdbAnnotationCodes"/>.
/// </summary>
public enum WfdbAnnotationCode : byte
{
    /// <summary>Not a QRS (0; not written in files, where code 0 with time 0 ends the file).</summary>
    NotQrs = 0,
    Normal = 1,
    LeftBundleBranchBlock = 2,
    RightBundleBranchBlock = 3,
    AberratedAtrialPremature = 4,
    PrematureVentricular = 5,
    FusionVentricularNormal = 6,
    NodalPremature = 7,
    AtrialPremature = 8,
    SupraventricularPremature = 9,
    VentricularEscape = 10,
    NodalEscape = 11,
    Paced = 12,
    Unclassifiable = 13,
    SignalQualityChange = 14,
    IsolatedQrsArtifact = 16,
    StChange = 18,
    TWaveChange = 19,
    Systole = 20,
    Diastole = 21,
    Comment = 22,
    Measurement = 23,
    PWavePeak = 24,
    BundleBranchBlock = 25,
    NonCapturedPacemakerArtifact = 26,
    TWavePeak = 27,
    RhythmChange = 28,
    UWavePeak = 29,
    NotClassifiedDuringLearning = 30,
    VentricularFlutterWave = 31,
    VentricularFlutterStart = 32,
    VentricularFlutterEnd = 33,
    AtrialEscape = 34,
    SupraventricularEscape = 35,
    Link = 36,
    NonConductedPWave = 37,
    FusionPacedNormal = 38,
    WaveformOnset = 39,
    WaveformEnd = 40,
    ROnTPrematureVentricular = 41,
}
