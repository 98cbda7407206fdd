using System.Globalization;
using System.Text;
using LongRecord.Analysis.Beats;

namespace LongRecord.Pipeline.Outputs;

/// <summary>
/// <c>beats.csv</c>: one row per detected beat, columns exactly
/// <c>sample,time_s,class,qrs_on,qrs_off,qrs_ms,p_wave,lead_quality</c>. Sample indices are 0-based at <c>f_ref</c>;
/// empty cells mean "not measured".
/// </summary>
public static class BeatsCsv
{
    public const string Header = "sample,time_s,class,qrs_on,qrs_off,qrs_ms,p_wave,lead_quality";

    public static void Write(string path, IReadOnlyList<Beat> beats, double referenceRateHz)
    {
        var inv = CultureInfo.InvariantCulture;
        using var w = new StreamWriter(path, append: false, new UTF8Encoding(false), 1 << 16);
        w.NewLine = "\n";
        w.WriteLine(Header);
        var line = new StringBuilder(96);
        foreach (var b in beats)
        {
            line.Clear();
            line.Append(b.Sample.ToString(inv)).Append(',');
            line.Append((b.Sample / referenceRateHz).ToString("0.####", inv)).Append(',');
            line.Append(ClassCode(b.Class)).Append(',');
            if (b.QrsOnOffset != Beat.Unknown)
            {
                line.Append((b.Sample + b.QrsOnOffset).ToString(inv));
            }

            line.Append(',');
            if (b.QrsOffOffset != Beat.Unknown)
            {
                line.Append((b.Sample + b.QrsOffOffset).ToString(inv));
            }

            line.Append(',');
            if (!float.IsNaN(b.QrsMs))
            {
                line.Append(b.QrsMs.ToString("0.#", inv));
            }

            line.Append(',');
            if (b.PWave >= 0)
            {
                line.Append(b.PWave == 1 ? '1' : '0');
            }

            line.Append(',').Append(LeadQualityCode(b.LeadQuality));
            w.WriteLine(line);
        }
    }

    public static char ClassCode(BeatClass c) => c switch
    {
        BeatClass.N => 'N',
        BeatClass.S => 'S',
        BeatClass.V => 'V',
        BeatClass.F => 'F',
        _ => 'Q',
    };

    public static string LeadQualityCode(LeadQuality q) => q switch
    {
        LeadQuality.Good => "good",
        LeadQuality.Noisy => "noisy",
        LeadQuality.SingleLead => "single-lead",
        _ => "",
    };
}
