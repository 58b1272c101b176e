using ThermVerify.Reporting.Plots;

namespace ThermVerify.Reporting;

/// <summary>A table of a report section: text cells, already formatted; cells that read as numbers are right-aligned.</summary>
public sealed record ReportTable(IReadOnlyList<string> Headers, IReadOnlyList<IReadOnlyList<string>> Rows);

/// <summary>One section of an analysis report: a heading, paragraphs in words, then tables.</summary>
public sealed record ReportSection(string Id, string Heading, IReadOnlyList<string> Paragraphs, IReadOnlyList<ReportTable> Tables);

/// <summary>
/// A report page on an analysis of a design (Monte Carlo, worst case, the fixed-resistor choice): the same frame as
/// the check report (verdict, design summary, figures, the design echoed, the cautions) around the analysis's own
/// sections. <see cref="Passed"/> is null where the analysis has no pass or fail.
/// </summary>
public sealed record AnalysisReport(
    string Heading,
    string? Description,
    string Verdict,
    bool? Passed,
    IReadOnlyList<(string Label, string Value)> Settings,
    string DesignFile,
    IReadOnlyList<RenderedPlot> Plots,
    IReadOnlyList<ReportSection> Sections,
    string DesignToml,
    Provenance.RunProvenance Provenance,
    string JsonSchema);
