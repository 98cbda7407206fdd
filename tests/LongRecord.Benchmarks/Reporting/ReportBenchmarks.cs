using BenchmarkDotNet.Attributes;
using BenchmarkDotNet.Engines;
using LongRecord.Reporting;
using LongRecord.Reporting.Model;
using LongRecord.Reporting.Templates;

namespace LongRecord.Benchmarks.Reporting;

/// <summary>
/// The report of a 72 h recording with 50 flagged episodes (the report issue's case: ≤ 2 s, ≤ 5 MB), rendered with
/// the standard template into memory. <c>dotnet run -c Release --project tests/LongRecord.Benchmarks -- --filter '*ReportBenchmarks*'</c>.
/// </summary>
[SimpleJob(RunStrategy.Monitoring, launchCount: 1, warmupCount: 1, iterationCount: 5)]
[MemoryDiagnoser]
public class ReportBenchmarks
{
    private ReportModel _model = null!;
    private ReportTemplate _template = null!;

    [GlobalSetup]
    public void Setup()
    {
        _model = LongReport.Model(72, 50);
        _template = TemplateLoader.Load("standard");
        using var stream = new MemoryStream();
        var pages = PdfReport.Render(stream, _model, _template, new BenchmarkStrips());
        Console.WriteLine(FormattableString.Invariant($"// report of 72 h with 50 flagged episodes: {pages} pages, {stream.Length / 1e6:F2} MB"));
    }

    [Benchmark]
    public long Render72h50Episodes()
    {
        using var stream = new MemoryStream();
        PdfReport.Render(stream, _model, _template, new BenchmarkStrips());
        return stream.Length;
    }
}
