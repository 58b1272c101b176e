using System.CommandLine;
using ThermVerify.Files;
using ThermVerify.Reporting;

namespace ThermVerify.Cli;

/// <summary>
/// The --json, --report and --force options the tolerance commands share. Existing outputs are refused before the
/// analysis runs (a Monte Carlo run is not thrown away at the end) and written through AtomicFile.
/// </summary>
internal sealed class AnalysisOutputs
{
    private readonly Option<FileInfo?> json = new("--json") { Description = "also write every number as JSON (schema in docs/json-output.md)" };
    private readonly Option<DirectoryInfo?> report = new("--report") { Description = "write report.html (self-contained), report.md and plots/ (PNG, SVG) into this folder" };
    private readonly Option<bool> force = new("--force") { Description = "replace an existing --json file or report in the --report folder" };

    public static AnalysisOutputs AddTo(Command command)
    {
        var outputs = new AnalysisOutputs();
        command.Options.Add(outputs.json);
        command.Options.Add(outputs.report);
        command.Options.Add(outputs.force);
        return outputs;
    }

    public void EnsureWritable(ParseResult parsed)
    {
        var overwrite = parsed.GetValue(force);
        if (parsed.GetValue(json) is { } file && !overwrite && file.Exists)
            throw new OutputExistsException($"{file} exists already; pass --force to replace it");
        if (parsed.GetValue(report) is { } folder)
            ReportDirectory.EnsureWritable(folder.FullName, overwrite);
    }

    /// <summary>Writes what was asked for; the report is built only then (its figures take a moment).</summary>
    public void Write(ParseResult parsed, Func<string> document, Func<AnalysisReport> page)
    {
        var overwrite = parsed.GetValue(force);
        if (parsed.GetValue(json) is { } file)
            AtomicFile.WriteAllText(file.FullName, document(), overwrite);
        if (parsed.GetValue(report) is { } folder)
        {
            ReportDirectory.Write(page(), folder.FullName, overwrite);
            parsed.InvocationConfiguration.Output.WriteLine(
                $"report: {Path.Combine(folder.ToString(), ReportDirectory.HtmlFile)}, {Path.Combine(folder.ToString(), ReportDirectory.MarkdownFile)}");
        }
    }
}
