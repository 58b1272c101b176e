using System.Globalization;
using System.Security.Cryptography;
using System.Text;
using ThermVerify.Check;
using ThermVerify.Design;
using ThermVerify.Sensors;

namespace ThermVerify.Baselines;

/// <summary>
/// Extracts the key figures from a check: the worst reported error and the smallest margin to the budget over the
/// whole range and in each budget region (the margin after the noise and the ramp lag), the worst settling,
/// DC-loading, average-sampling and buffer errors and the noise at its coverage at the pin in LSB, and the counts of
/// points over budget and of failing findings.
/// </summary>
internal static class BaselineFigures
{
    /// <summary>Tolerances written into a new baseline. The check is deterministic, so these only absorb numerical
    /// differences between versions of the solver (step control, extrapolation); they are far below any budget.</summary>
    public const double KelvinTolerance = 0.01;
    public const double LsbTolerance = 0.05;

    public static Baseline From(CheckResult result, Provenance.RunProvenance provenance)
    {
        var design = result.Design;
        var figures = new List<BaselineFigure>();
        AddRegion(figures, result.Points, "", $"over the check range {Range(design.Check.Range)}");
        foreach (var region in design.Check.Regions)
            AddRegion(figures, [.. result.Points.Where(p => region.Range.Contains(p.Celsius))], $"[{Range(region.Range)}]", $"in the region {Range(region.Range)}");

        var lsb = result.Adc.LsbVolts;
        figures.Add(Lsb("settling.worst", "worst settling error at the pin (sample minus DC pin voltage)", result, p => p.Simulated.WorstSettlingVolts, lsb));
        figures.Add(Lsb("loading.worst", "worst DC loading error at the pin (leakage, fixed-resistor drift)", result, p => p.Simulated.DcLoadingVolts, lsb));
        figures.Add(Lsb("sampling-average.worst", "worst error from the average sampling current", result, p => p.Simulated.AverageSamplingVolts, lsb));
        figures.Add(Lsb("buffer.worst", "worst buffer error (offset and drift, bias currents, finite gain)", result, p => p.Simulated.BufferVolts, lsb));
        figures.Add(Lsb("converter.worst", "worst code shift from the converter's static errors (offset, gain, INL, reference)", result, p => p.Simulated.ConverterVolts, lsb));
        figures.Add(Lsb("noise.worst", "worst noise of a reading at its coverage (±k·σ at the pin)", result, p => p.Noise?.CoveredVolts ?? 0, lsb));
        figures.Add(new BaselineFigure("points.over-budget", "points outside the budget", result.Points.Count(p => !p.WithinBudget), "points", Better.Lower, 0));
        figures.Add(new BaselineFigure("findings.fail", "failing findings", result.Findings.Count(f => f.Severity == Severity.Fail), "findings", Better.Lower, 0));
        return new Baseline(design.Name, Fingerprint(design), provenance.ToolVersion, figures) { Provenance = provenance };
    }

    public static string Fingerprint(FrontEndDesign design) =>
        Convert.ToHexStringLower(SHA256.HashData(Encoding.UTF8.GetBytes(DesignWriter.ToToml(design))));

    private static void AddRegion(List<BaselineFigure> figures, IReadOnlyList<CheckPoint> points, string suffix, string where)
    {
        if (points.Count == 0) return;
        double? worst = points.Any(p => !double.IsFinite(p.ErrorKelvin)) ? null : points.Max(p => Math.Abs(p.ErrorKelvin));
        double? margin = worst is null ? null : points.Min(p => p.BudgetKelvin - Math.Abs(p.ErrorKelvin) - p.NoiseKelvin - p.RampLagKelvin);
        figures.Add(new BaselineFigure("error.worst" + suffix, $"worst |reported − true| {where}", worst, "K", Better.Lower, KelvinTolerance));
        figures.Add(new BaselineFigure("margin.smallest" + suffix, $"smallest margin (budget − |error| − noise − ramp lag) {where}", margin, "K", Better.Higher, KelvinTolerance));
    }

    private static BaselineFigure Lsb(string id, string description, CheckResult result, Func<CheckPoint, double> volts, double lsb) =>
        new(id, description, result.Points.Max(p => Math.Abs(volts(p))) / lsb, "LSB", Better.Lower, LsbTolerance);

    private static string Range(Sensors.TemperatureRange range) =>
        string.Create(CultureInfo.InvariantCulture, $"{range.MinCelsius:0.##} degC .. {range.MaxCelsius:0.##} degC");
}
