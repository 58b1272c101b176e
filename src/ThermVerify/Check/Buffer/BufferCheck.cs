using ThermVerify.Design;

namespace ThermVerify.Check.Buffer;

/// <summary>
/// The buffer sections of `check`, run after the points are known (recovery is judged where the check found the
/// largest settling error). Headroom and static errors use every point of the check; the loop gain the ends and the
/// middle of the range; noise a grid of five temperatures.
/// </summary>
internal static class BufferCheck
{
    private const int NoiseTemperatures = 5;

    public static BufferReport Run(FrontEndDesign design, IReadOnlyList<CheckPoint> points, CheckOptions options)
    {
        BufferCircuits.Require(design);
        var temperatures = points.Select(p => p.Celsius).ToArray();
        var stability = BufferStability.Run(design, options.ComputeRemedies, options.Engine);
        var headroom = BufferHeadroom.Run(design, temperatures);
        var statics = BufferStaticErrors.Run(design, temperatures);
        var settling = points.Where(p => p.SamplingSimulated).DefaultIfEmpty(points[0])
            .MaxBy(p => Math.Abs(p.Simulated.WorstSettlingVolts))!;
        RecoveryResult? recovery = headroom.Violations.Any(v => v.Limit == "output swing")
            ? null // a clipped output has no small-signal recovery to speak of; headroom is the finding
            : BufferRecovery.Run(design, settling.Celsius, settling.PrechargeVolts, options.ComputeRemedies, options.Engine);
        var grid = Enumerable.Range(0, NoiseTemperatures)
            .Select(i => design.Check.Range.MinCelsius + i * (design.Check.Range.MaxCelsius - design.Check.Range.MinCelsius) / (NoiseTemperatures - 1))
            .Distinct().ToArray();
        var noise = BufferNoise.Run(design, grid, options.Engine);
        var findings = BufferFindingRules.Evaluate(design, points, stability, headroom, recovery);
        return new BufferReport(stability, headroom, statics, recovery, noise, findings);
    }
}
