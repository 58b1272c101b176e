using ThermVerify.Baselines;
using ThermVerify.Check;
using ThermVerify.Design;
using ThermVerify.Reporting.Plots;

namespace ThermVerify.Reporting;

/// <summary>Everything a report page shows: the check, the design it ran on (normal form), the figures and an optional baseline comparison.</summary>
public sealed record CheckReport(CheckResult Result, string DesignFile, string DesignToml, IReadOnlyList<RenderedPlot> Plots, BaselineComparison? Baseline,
    Provenance.RunProvenance Provenance)
{
    /// <summary>Renders the figures (one extra sampling transient at the worst point) and echoes the design.</summary>
    public static CheckReport Build(CheckResult result, Provenance.RunProvenance provenance, string designFile, BaselineComparison? baseline = null) =>
        new(result, designFile, DesignWriter.ToToml(result.Design), CheckPlots.Render(result), baseline, provenance);
}
