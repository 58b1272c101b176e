namespace ThermVerify.Reporting.Plots;

/// <summary>One figure of a report, rendered both ways: PNG for Markdown and viewers, SVG for the HTML page.</summary>
public sealed record RenderedPlot(string FileStem, string Title, string Caption, byte[] Png, string Svg);
