using ScottPlot;
using ThermVerify.Quantities;

namespace ThermVerify.Reporting.Plots;

/// <summary>The look every report figure shares: a sans-serif face, a size that reads on a laptop screen, fixed colours per quantity.</summary>
internal static class PlotStyle
{
    public const int WidthPixels = 960;
    public const int HeightPixels = 600;

    // ScottPlot's default face resolves to a serif font on Debian; DejaVu Sans ships with fonts-dejavu-core.
    private static readonly Lock FontLock = new();
    private static bool fontSet;

    public static readonly Color Closed = Color.FromHex("#1f77b4");
    public static readonly Color Simulated = Color.FromHex("#d62728");
    public static readonly Color Pin = Color.FromHex("#2ca02c");
    public static readonly Color Code = Color.FromHex("#9467bd");
    public static readonly Color Total = Color.FromHex("#000000");
    public static readonly Color Budget = Color.FromHex("#2ca02c");
    public static readonly Color Limit = Color.FromHex("#d62728");
    public static readonly Color[] Series =
        [Color.FromHex("#1f77b4"), Color.FromHex("#ff7f0e"), Color.FromHex("#9467bd"), Color.FromHex("#8c564b"), Color.FromHex("#e377c2"), Color.FromHex("#17becf")];

    public static Plot NewPlot(string title, string xLabel, string yLabel)
    {
        lock (FontLock)
        {
            if (!fontSet)
            {
                Fonts.Default = "DejaVu Sans";
                fontSet = true;
            }
        }
        var plot = new Plot();
        plot.Title(title, size: 18);
        plot.XLabel(xLabel, size: 15);
        plot.YLabel(yLabel, size: 15);
        foreach (var axis in new IAxis[] { plot.Axes.Bottom, plot.Axes.Left, plot.Axes.Right })
            axis.TickLabelStyle.FontSize = 13;
        plot.Grid.MajorLineColor = Color.FromHex("#e0e0e0");
        return plot;
    }

    /// <summary>A line that breaks where values do not exist (NaN), labelled once in the legend.</summary>
    public static void AddLine(Plot plot, double[] xs, double[] ys, string label, Color color, float width = 2, LinePattern? pattern = null, IYAxis? yAxis = null)
    {
        var labelled = false;
        var start = 0;
        while (start < xs.Length)
        {
            while (start < xs.Length && !double.IsFinite(ys[start])) start++;
            var end = start;
            while (end < xs.Length && double.IsFinite(ys[end])) end++;
            if (end > start)
            {
                var line = end - start == 1
                    ? plot.Add.ScatterPoints(xs[start..end], ys[start..end])
                    : plot.Add.ScatterLine(xs[start..end], ys[start..end]);
                line.Color = color;
                line.LineWidth = width;
                line.MarkerSize = end - start == 1 ? 6 : 0;
                line.LinePattern = pattern ?? LinePattern.Solid;
                if (yAxis is not null) line.Axes.YAxis = yAxis;
                if (!labelled) line.LegendText = label;
                labelled = true;
            }
            start = end;
        }
    }

    /// <summary>A filled band between two curves; temperatures where either edge does not exist (an unreadable unit) are left out.</summary>
    public static ScottPlot.Plottables.FillY Band(Plot plot, IEnumerable<double> xs, IEnumerable<double> lows, IEnumerable<double> highs, Color color, double alpha, string label)
    {
        var rows = xs.Zip(lows, highs).Where(r => double.IsFinite(r.Second) && double.IsFinite(r.Third)).ToArray();
        var band = plot.Add.FillY([.. rows.Select(r => r.First)], [.. rows.Select(r => r.Second)], [.. rows.Select(r => r.Third)]);
        band.FillColor = color.WithAlpha(alpha);
        band.LineWidth = 0;
        band.LegendText = label;
        return band;
    }

    /// <summary>Tick marks at 1, 2 and 5 of each decade for an axis drawn in log₁₀ of a value, labelled in the value's unit.</summary>
    public static void LogTicks(IAxis axis, double low, double high, Func<double, string> label)
    {
        var ticks = new List<double>();
        for (var decade = Math.Floor(Math.Log10(low)); decade <= Math.Ceiling(Math.Log10(high)); decade++)
            foreach (var m in (double[])[1, 2, 5])
                if (m * Math.Pow(10, decade) is var v && v >= low / 1.001 && v <= high * 1.001) ticks.Add(v);
        if (ticks.Count < 2) ticks = [low, high];
        axis.SetTicks([.. ticks.Select(Math.Log10)], [.. ticks.Select(label)]);
    }

    /// <summary>
    /// Tick marks at each power of ten for an axis drawn in log₁₀ of a frequency, labelled in hertz with a prefix
    /// ("10 Hz", "1 kHz", "1 MHz"): a Bode plot spans many decades, where 1-2-5 marks would crowd.
    /// </summary>
    public static void DecadeTicksHertz(IAxis axis, double lowHertz, double highHertz)
    {
        var ticks = new List<double>();
        for (var decade = Math.Ceiling(Math.Log10(lowHertz) - 1e-9); decade <= Math.Floor(Math.Log10(highHertz) + 1e-9); decade++)
            ticks.Add(decade);
        if (ticks.Count < 2)
        {
            LogTicks(axis, lowHertz, highHertz, Hertz);
            return;
        }
        axis.SetTicks([.. ticks], [.. ticks.Select(d => Hertz(Math.Pow(10, d)))]);
    }

    public static string Hertz(double hertz) => EngineeringFormat.Format(hertz, UnitKind.Hertz, 3);

    public static RenderedPlot Render(Plot plot, string stem, string title, string caption) =>
        new(stem, title, caption, plot.GetImageBytes(WidthPixels, HeightPixels, ImageFormat.Png), plot.GetSvgXml(WidthPixels, HeightPixels));
}
