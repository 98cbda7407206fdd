namespace LongRecord.Formats.Wfdb;

/// <summary>
/// Mnemonics of the standard annotation codes and the beat classes of ANSI/AAMI EC57. Mnemonics follow the table
/// "Annotation Codes" of the WFDB Programmer's Guide (physionet.org/physiotools/wpg, section 4.1) and PhysioBank's
/// annotations page, which rdann and the PhysioNet databases use.
/// </summary>
public static class WfdbAnnotationCodes
{
    /// <summary>Largest annotation code a file may carry; 50–58 are unused, 59–63 are the format's own words.</summary>
    public const int MaxCode = 58;

    private static readonly string?[] s_mnemonics = BuildMnemonics();

    // ANSI/AAMI EC57 beat labels: N L R B A a J S V r F e j n E / f Q.
    private static readonly bool[] s_beat = BuildBeats();

    /// <summary>The one-character mnemonic (for example <c>N</c>, <c>V</c>, <c>(</c>), or null for codes without one.</summary>
    public static string? Mnemonic(WfdbAnnotationCode code) => (int)code < s_mnemonics.Length ? s_mnemonics[(int)code] : null;

    /// <summary>The code whose mnemonic is <paramref name="mnemonic"/>, or null when none has it.</summary>
    public static WfdbAnnotationCode? FromMnemonic(string mnemonic)
    {
        var i = Array.IndexOf(s_mnemonics, mnemonic);
        return i < 0 ? null : (WfdbAnnotationCode)i;
    }

    /// <summary>True for the beat annotation codes of ANSI/AAMI EC57 (N L R B A a J S V r F e j n E / f Q).</summary>
    public static bool IsBeat(WfdbAnnotationCode code) => (int)code < s_beat.Length && s_beat[(int)code];

    private static string?[] BuildMnemonics()
    {
        var m = new string?[42];
        void Set(WfdbAnnotationCode c, string s) => m[(int)c] = s;
        Set(WfdbAnnotationCode.Normal, "N");
        Set(WfdbAnnotationCode.LeftBundleBranchBlock, "L");
        Set(WfdbAnnotationCode.RightBundleBranchBlock, "R");
        Set(WfdbAnnotationCode.AberratedAtrialPremature, "a");
        Set(WfdbAnnotationCode.PrematureVentricular, "V");
        Set(WfdbAnnotationCode.FusionVentricularNormal, "F");
        Set(WfdbAnnotationCode.NodalPremature, "J");
        Set(WfdbAnnotationCode.AtrialPremature, "A");
        Set(WfdbAnnotationCode.SupraventricularPremature, "S");
        Set(WfdbAnnotationCode.VentricularEscape, "E");
        Set(WfdbAnnotationCode.NodalEscape, "j");
        Set(WfdbAnnotationCode.Paced, "/");
        Set(WfdbAnnotationCode.Unclassifiable, "Q");
        Set(WfdbAnnotationCode.SignalQualityChange, "~");
        Set(WfdbAnnotationCode.IsolatedQrsArtifact, "|");
        Set(WfdbAnnotationCode.StChange, "s");
        Set(WfdbAnnotationCode.TWaveChange, "T");
        Set(WfdbAnnotationCode.Systole, "*");
        Set(WfdbAnnotationCode.Diastole, "D");
        Set(WfdbAnnotationCode.Comment, "\"");
        Set(WfdbAnnotationCode.Measurement, "=");
        Set(WfdbAnnotationCode.PWavePeak, "p");
        Set(WfdbAnnotationCode.BundleBranchBlock, "B");
        Set(WfdbAnnotationCode.NonCapturedPacemakerArtifact, "^");
        Set(WfdbAnnotationCode.TWavePeak, "t");
        Set(WfdbAnnotationCode.RhythmChange, "+");
        Set(WfdbAnnotationCode.UWavePeak, "u");
        Set(WfdbAnnotationCode.NotClassifiedDuringLearning, "?");
        Set(WfdbAnnotationCode.VentricularFlutterWave, "!");
        Set(WfdbAnnotationCode.VentricularFlutterStart, "[");
        Set(WfdbAnnotationCode.VentricularFlutterEnd, "]");
        Set(WfdbAnnotationCode.AtrialEscape, "e");
        Set(WfdbAnnotationCode.SupraventricularEscape, "n");
        Set(WfdbAnnotationCode.Link, "@");
        Set(WfdbAnnotationCode.NonConductedPWave, "x");
        Set(WfdbAnnotationCode.FusionPacedNormal, "f");
        Set(WfdbAnnotationCode.WaveformOnset, "(");
        Set(WfdbAnnotationCode.WaveformEnd, ")");
        Set(WfdbAnnotationCode.ROnTPrematureVentricular, "r");
        return m;
    }

    private static bool[] BuildBeats()
    {
        var b = new bool[42];
        foreach (var s in "N L R B A a J S V r F e j n E / f Q".Split(' '))
        {
            b[(int)FromMnemonic(s)!.Value] = true;
        }

        return b;
    }
}
