using ScottPlot;
using ThermVerify.Tolerances;

namespace ThermVerify.Reporting.Plots;

/// <summary>The tolerances ranked by their share of the error variance, largest at the top, as horizontal bars.</summary>
internal static class ContributorsPlot
{
    public static RenderedPlot Render(MonteCarloResult result, string designName)
    {
        var shares = result.Contributors;
        var plot = PlotStyle.NewPlot(FormattableString.Invariant($"Contributors to the error variance at {result.ContributorsCelsius:0.##} °C"),
            "Share of the variance (%)", "");
        // Largest share at the top: ScottPlot counts positions upwards.
        var bars = shares.Select((s, i) => new Bar
        {
            Position = shares.Count - 1 - i,
            Value = 100 * s.Share,
            Size = 0.7,
            FillColor = s.Kind is null ? Colors.Gray : PlotStyle.Closed,
            LineWidth = 0,
            Label = FormattableString.Invariant($"{100 * s.Share:0.0} %"),
        }).ToList();
        var plottable = plot.Add.Bars(bars);
        plottable.Horizontal = true;
        plot.Axes.Left.SetTicks([.. shares.Select((_, i) => (double)(shares.Count - 1 - i))], [.. shares.Select(s => Label(s.Key))]);
        plot.Axes.Left.MajorTickStyle.Length = 0;
        plot.Axes.SetLimits(0, 112, -0.6, Math.Max(shares.Count, 1) - 0.4);
        if (shares.Count == 0)
        {
            // An empty frame would read as a drawing failure.
            var note = plot.Add.Text(Empty(result), 56, 0);
            note.LabelFontSize = 18;
            note.LabelAlignment = Alignment.MiddleCenter;
        }

        return PlotStyle.Render(plot, "montecarlo-contributors", "Contributors to the error variance",
            FormattableString.Invariant($"At {result.ContributorsCelsius:0.##} °C, where the units spread most (σ = {Math.Sqrt(result.VarianceKelvinSquared):0.####} K), ") +
            "a least-squares fit of the unquantised error on each unit's deviations gives each tolerance's share bᵢ²σᵢ²/(Σⱼbⱼ²σⱼ² + residual); " +
            "the grey bar is what the linear fit leaves (second-order effects and each unit's own settling)." +
            (shares.Count == 0 ? $" {Empty(result)}." : ""));
    }

    private static string Empty(MonteCarloResult result) => result.Parameters.Count == 0
        ? "No tolerance in the design: nothing to rank"
        : "No shares: too few units for the fit, or the units do not spread";

    /// <summary>The design key without its section where the section is obvious; the residual line shortened to fit the axis.</summary>
    private static string Label(string key) => key == VarianceShares.RestKey ? "nonlinear and settling" : key;
}
