using System.Globalization;
using System.Text;
using LongRecord.Analysis.Quality;

namespace LongRecord.Pipeline.Outputs;

/// <summary>
/// <c>quality.csv</c>: the recording cut into stretches of one verdict, columns exactly
/// <c>start_s,end_s,analysable,reason</c> (<c>analysable</c> 1 or 0; reasons <c>ok</c>, <c>noise</c>, <c>lead-off</c>,
/// <c>saturation</c>, <c>missing</c>, <c>flat-all-leads</c>, <c>chaotic-all-leads</c>).
/// </summary>
public static class QualityCsv
{
    public const string Header = "start_s,end_s,analysable,reason";

    public static void Write(string path, IEnumerable<QualityStretch> stretches)
    {
        var inv = CultureInfo.InvariantCulture;
        using var w = new StreamWriter(path, append: false, new UTF8Encoding(false));
        w.NewLine = "\n";
        w.WriteLine(Header);
        foreach (var s in stretches)
        {
            w.WriteLine(string.Create(inv, $"{s.StartS:0.###},{s.EndS:0.###},{(s.Analysable ? 1 : 0)},{s.Reason.Code()}"));
        }
    }
}
