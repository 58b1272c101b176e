using System.Text.RegularExpressions;
using ThermVerify.Reporting.Plots;

namespace ThermVerify.Tests.Reporting;

public sealed class PlotAxisTests
{
    [Fact]
    public void A_frequency_axis_is_labelled_in_hertz_at_each_decade()
    {
        var plot = PlotStyle.NewPlot("loop gain", "Frequency", "|T| (dB)");
        double[] logF = [-1, 0, 1, 2, 3, 4, 5, 6, 7];
        PlotStyle.AddLine(plot, logF, [.. logF.Select(x => 60 - 20 * x)], "|T|", PlotStyle.Closed, 2);
        PlotStyle.DecadeTicksHertz(plot.Axes.Bottom, 0.1, 1e7);
        var svg = plot.GetSvgXml(PlotStyle.WidthPixels, PlotStyle.HeightPixels);
        foreach (var label in new[] { "100 mHz", "1 Hz", "10 Hz", "100 Hz", "1 kHz", "10 kHz", "100 kHz", "1 MHz", "10 MHz" })
            Assert.Contains(label, Labels(svg));
        Assert.DoesNotContain("log₁₀", svg);
    }

    [Fact]
    public void Less_than_two_decades_falls_back_to_marks_at_one_two_and_five()
    {
        var plot = PlotStyle.NewPlot("narrow", "Frequency", "y");
        PlotStyle.AddLine(plot, [Math.Log10(150), Math.Log10(900)], [0, 1], "y", PlotStyle.Closed, 2);
        PlotStyle.DecadeTicksHertz(plot.Axes.Bottom, 150, 900);
        var svg = plot.GetSvgXml(PlotStyle.WidthPixels, PlotStyle.HeightPixels);
        Assert.Contains("200 Hz", Labels(svg));
        Assert.Contains("500 Hz", Labels(svg));
    }

    /// <summary>The texts of the SVG's text elements (ScottPlot writes each label on its own indented line).</summary>
    private static string[] Labels(string svg) =>
        [.. Regex.Matches(svg, @"<text[^>]*>\s*([^<]*?)\s*</text>").Select(m => m.Groups[1].Value)];
}
