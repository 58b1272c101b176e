using System.CommandLine;
using ThermVerify.Files;
using ThermVerify.Reporting;

namespace ThermVerify.Cli;

/// <summary>
/// The --json, --report and --force options the analysis commands share. A command declares its outputs in one
/// <see cref="OutputSet"/> before the work (so a refusal costs nothing: a Monte Carlo run is not thrown away at the
/// end) and writes the set after it; the contents are rendered only then.
/// </summary>
internal sealed class AnalysisOutputs
{
    private readonly Option<FileInfo?> json = new("--json") { Description = "also write every number as JSON (schema in docs/json-output.md)" };
    private readonly Option<DirectoryInfo?> report = new("--report") { Description = "write report.html (self-contained), report.md and plots/ (PNG, SVG) into this folder" };
    private readonly Option<bool> force = new("--force") { Description = "replace existing output files (--json, --csv, the --report folder's report)" };

    public static AnalysisOutputs AddTo(Command command)
    {
        var outputs = new AnalysisOutputs();
        command.Options.Add(outputs.json);
        command.Options.Add(outputs.report);
        command.Options.Add(outputs.force);
        return outputs;
    }

    /// <summary>A set for this run's outputs, replacing files only with --force.</summary>
    public OutputSet NewSet(ParseResult parsed) => new(parsed.GetValue(force));

    /// <summary>Adds --json and --report to <paramref name="set"/>; the report is built only when the set is written (its figures take a moment).</summary>
    public void Declare(ParseResult parsed, OutputSet set, Func<string> document, Func<AnalysisReport> page)
    {
        if (parsed.GetValue(json) is { } file)
            set.Add(file.ToString(), document);
        if (parsed.GetValue(report) is { } folder)
            set.AddFolder(folder.ToString(), () => ReportDirectory.Files(page()), ReportDirectory.ExpectedFiles);
    }

    /// <summary>Says where the report went, after the set was written.</summary>
    public void Announce(ParseResult parsed)
    {
        if (parsed.GetValue(report) is { } folder)
            parsed.InvocationConfiguration.Output.WriteLine(
                $"report: {Path.Combine(folder.ToString(), ReportDirectory.HtmlFile)}, {Path.Combine(folder.ToString(), ReportDirectory.MarkdownFile)}");
    }
}
