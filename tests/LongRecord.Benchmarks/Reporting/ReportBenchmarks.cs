using BenchmarkDotNet.Attributes;
using BenchmarkDotNet.Configs;
using BenchmarkDotNet.Engines;
using BenchmarkDotNet.Jobs;
using BenchmarkDotNet.Toolchains.InProcess.Emit;
using LongRecord.Reporting;
using LongRecord.Reporting.Model;
using LongRecord.Reporting.Templates;

namespace LongRecord.Benchmarks.Reporting;

/// <summary>
/// The report of a 72 h recording with 50 flagged episodes (the report issue's case: ≤ 2 s, ≤ 5 MB), rendered with
/// the standard template into memory. <c>dotnet run -c Release --project tests/LongRecord.Benchmarks -- --filter '*ReportBenchmarks*'</c>.
/// </summary>
[Config(typeof(InProcessMonitoring))]
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
        // CPU time as well as wall time: on a shared machine the wall clock also counts other processes' turns.
        var cpu = System.Diagnostics.Process.GetCurrentProcess().TotalProcessorTime;
        for (var i = 0; i < 3; i++)
        {
            Render72h50Episodes();
        }

        var cpuS = (System.Diagnostics.Process.GetCurrentProcess().TotalProcessorTime - cpu).TotalSeconds / 3;
        Console.WriteLine(FormattableString.Invariant($"// report of 72 h with 50 flagged episodes: {pages} pages, {stream.Length / 1e6:F2} MB, {cpuS:F2} s of CPU per render (mean of 3)"));
    }

    [Benchmark]
    public long Render72h50Episodes()
    {
        using var stream = new MemoryStream();
        PdfReport.Render(stream, _model, _template, new BenchmarkStrips());
        return stream.Length;
    }

    // In process: on a busy 2-core machine the generated benchmark project can take longer to build than
    // BenchmarkDotNet waits for. Five timed renders after one warm-up.
    private sealed class InProcessMonitoring : ManualConfig
    {
        public InProcessMonitoring()
        {
            AddJob(Job.Default.WithToolchain(InProcessEmitToolchain.Instance).WithStrategy(RunStrategy.Monitoring)
                .WithLaunchCount(1).WithWarmupCount(1).WithIterationCount(5));
        }
    }
}
