namespace ThermVerify.Files;

/// <summary>Why an output could not be rendered, as far as the writer that refused tells.</summary>
public enum RenderFailure
{
    /// <summary>A figure is not a finite number (the JSON writer refuses infinity and NaN).</summary>
    NonFiniteFigure,

    /// <summary>A text holds a character the format cannot carry (XML and control characters).</summary>
    UnwritableText,

    /// <summary>The plotting library could not draw the figures (an axis span it cannot divide).</summary>
    Drawing,
}

/// <summary>
/// An output could not be rendered from the results: the writer of its format (JSON, XML, the plotting library)
/// refused a value. Nothing of the set was written.
/// </summary>
public sealed class OutputRenderException(string path, Exception inner)
    : Exception($"{path} cannot be written: {Explain(inner)}; no output file was written or changed", inner)
{
    public RenderFailure Failure { get; } = Classify(inner) ?? RenderFailure.Drawing;

    /// <summary>True for the exceptions the format writers throw on values they cannot carry.</summary>
    public static bool Explains(Exception e) => Classify(e) is not null;

    private static RenderFailure? Classify(Exception e)
    {
        var source = e.TargetSite?.Module.Assembly.GetName().Name ?? "";
        if (source.StartsWith("System.Text.Json", StringComparison.Ordinal) && e is ArgumentException or InvalidOperationException)
            return RenderFailure.NonFiniteFigure;
        if (e is System.Xml.XmlException || (source.Contains("Xml", StringComparison.Ordinal) && e is ArgumentException))
            return RenderFailure.UnwritableText;
        if (source.StartsWith("ScottPlot", StringComparison.Ordinal) || source.StartsWith("SkiaSharp", StringComparison.Ordinal))
            return RenderFailure.Drawing;
        return null;
    }

    private static string Explain(Exception e) => Classify(e) switch
    {
        RenderFailure.NonFiniteFigure => $"a figure of the results is not a finite number ({e.Message.TrimEnd('.')})",
        RenderFailure.UnwritableText => $"a text holds a character the format cannot carry ({e.Message.TrimEnd('.')})",
        _ => $"the plotting library could not draw the figures ({e.Message.TrimEnd('.')})",
    };
}
