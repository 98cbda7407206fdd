using System.CommandLine;
using LongRecord.Pipeline.Privacy;
using LongRecord.Pipeline.Report;
using LongRecord.Reporting.Templates;

namespace LongRecord.Cli.Commands;

/// <summary>The report options shared by <c>summarise</c> and <c>demo</c>: <c>--template</c>, <c>--deidentify</c>, <c>--key-file</c>.</summary>
public sealed class ReportCommandOptions
{
    public Option<string?> Template { get; } = new("--template")
    {
        Description = $"Report layout: a built-in template ({string.Join(", ", TemplateLoader.BuiltInNames)}) or a JSON file (schema in report-templates/README.md). Default: standard",
    };

    public Option<bool> Deidentify { get; } = new("--deidentify")
    {
        Description = "Hide patient name, ID and birth date everywhere: each recording is named by a stable pseudonym (a keyed hash of its relative path) in folders, files, the report and messages",
    };

    public Option<FileInfo?> KeyFile { get; } = new("--key-file")
    {
        Description = "With --deidentify: the secret key file (created when absent) that keeps pseudonyms stable across runs and shards, and the only place the pseudonym-to-patient mapping is written",
    };

    public void AddTo(Command command)
    {
        command.Options.Add(Template);
        command.Options.Add(Deidentify);
        command.Options.Add(KeyFile);
    }

    /// <summary>The options as given; a bad template or key file is a user error listing its problems.</summary>
    public ReportOptions Resolve(ParseResult parse)
    {
        var keyFile = parse.GetValue(KeyFile);
        var deidentify = parse.GetValue(Deidentify);
        if (keyFile is not null && !deidentify)
        {
            throw new UserInputException("--key-file is only used with --deidentify");
        }

        try
        {
            return new ReportOptions
            {
                Template = TemplateLoader.Load(parse.GetValue(Template) ?? "standard"),
                Privacy = deidentify ? Pseudonyms.Open(keyFile?.FullName) : null,
            };
        }
        catch (ReportTemplateException e)
        {
            throw new UserInputException(e.Message);
        }
        catch (PseudonymKeyException e)
        {
            throw new UserInputException(e.Message);
        }
    }
}
