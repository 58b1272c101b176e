using ThermVerify.Circuits;
using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Quantities;
using ThermVerify.Simulation;

namespace ThermVerify.Check.Buffer;

/// <summary>One noise generator's rms share at the sampling capacitor.</summary>
public sealed record NoiseContribution(string Element, string Label, double RmsVolts);

/// <summary>The noise the ADC samples at one temperature: rms in V, LSB and K, split by generator.</summary>
public sealed record NoisePoint(
    double Celsius,
    double RmsVolts,
    double RmsLsb,
    double RmsKelvin,
    double SamplingRmsVolts,
    double FrontEndRmsVolts,
    double KtcVolts,
    IReadOnlyList<NoiseContribution> Contributions);

/// <summary>The rms of the mean of N conversions: for uncorrelated (white) samples, and with the filter's correlation between samples.</summary>
public sealed record AveragingGain(int Conversions, double WhiteRmsVolts, double CorrelatedRmsVolts, double CorrelatedRmsKelvin);

public sealed record NoiseReport(
    double FromHertz,
    double ToHertz,
    IReadOnlyList<NoisePoint> Points,
    double FilterTimeConstantSeconds,
    double SampleCorrelation,
    IReadOnlyList<AveragingGain> Averaging,
    string Method)
{
    public NoisePoint Worst => Points.MaxBy(p => p.RmsVolts)!;
}

/// <summary>
/// Noise at the sampling capacitor during an acquisition, from the engine's noise analysis (adjoint method): every
/// resistor (sensor, fixed, isolation, filter, the closed switch) at the circuit's temperature (Johnson–Nyquist,
/// 4kTR), the op-amp's input voltage and current noise with their 1/f corner. The switch's share is the sampling
/// capacitor's kT/C: integrated over all frequencies, a resistor's noise on a capacitor is kT/C whatever the
/// resistance. The density is integrated from 0.1 Hz (slower 1/f wander is drift, not noise) to 1000× the fastest
/// pole of the circuit (the switch's R·C_sh, the op-amp's GBW, the filter), so the band is the circuit's own.
/// Averaging N conversions: the switch's kT/C is reset at every acquisition, so it is uncorrelated and falls as
/// σ/√N; the front end's noise is low-passed by the filter, so successive samples T_s apart correlate as
/// ρ = e^(−T_s/τ) with τ = (R_iso + R_filter)·(C_res + C_pin) (single-pole assumption), and the variance of the
/// mean of N is σ²/N·[1 + 2Σ(1 − k/N)ρ^k]. The white column assumes every sample independent (ρ = 0).
/// </summary>
internal static class BufferNoise
{
    public const double FromHertz = 0.1;
    private const int PointsPerDecade = 20;
    private static readonly int[] AveragedConversions = [1, 4, 16, 64, 256];

    public static NoiseReport Run(FrontEndDesign design, IReadOnlyList<double> temperaturesCelsius, ICheckEngine? engine = null)
    {
        var b = BufferCircuits.Require(design);
        var model = new ClosedFormModel(design);
        var adc = design.Adc;
        var fastest = Math.Max(b.GainBandwidthHertz, adc.SamplingCapacitanceFarads > 0
            ? 1 / (2 * Math.PI * Math.Max(adc.SwitchResistanceOhms, 1) * adc.SamplingCapacitanceFarads) : 0);
        var to = 1000 * fastest;
        var sweep = FrequencySweep.Logarithmic(FromHertz, to, PointsPerDecade);
        var node = adc.SamplingCapacitanceFarads > 0 ? FrontEndNodes.Hold : FrontEndCircuit.PinNode(design);

        var points = temperaturesCelsius.Select(t =>
        {
            var cf = model.At(t);
            var ktc = adc.SamplingCapacitanceFarads > 0
                ? Math.Sqrt(PhysicalConstants.BoltzmannJoulesPerKelvin * PhysicalConstants.ToKelvin(t) / adc.SamplingCapacitanceFarads) : 0;
            List<NoiseContribution> parts;
            double total, sampling;
            if (b.Subcircuit is null)
            {
                var noise = NoiseAnalysis.Run(BufferCircuits.Acquiring(design, t), node, sweep);
                parts = noise.Generators.Distinct()
                    .Select(g => new NoiseContribution(g.Element, g.Label, noise.GeneratorRmsVolts(g.Element, g.Label)))
                    .Where(c => c.RmsVolts > 0).OrderByDescending(c => c.RmsVolts).ToList();
                total = noise.RmsVolts();
                sampling = parts.Where(p => p.Element == BufferCircuits.SwitchResistor).Sum(p => p.RmsVolts * p.RmsVolts);
            }
            else
            {
                // The design's own subcircuit: the engine's total at the node; the switch's share is its kT/C.
                total = SubcircuitBuffer.NoiseRmsVolts(BufferCircuits.Acquiring(design, t), node, sweep, engine ?? BuiltInEngine.Instance);
                sampling = Math.Min(ktc * ktc, total * total);
                parts = [new NoiseContribution(BufferCircuits.OpAmpName, "total (the engine gives no split by generator)", total)];
            }
            var frontEnd = Math.Sqrt(Math.Max(0, total * total - sampling));
            return new NoisePoint(t, total, total / model.Adc.LsbVolts, total / Math.Abs(cf.VoltsPerKelvin), Math.Sqrt(sampling), frontEnd, ktc, parts);
        }).ToList();

        var tau = (b.IsolationResistorOhms + design.Filter.SeriesResistorOhms) * (design.Filter.ReservoirCapacitorFarads + adc.PinCapacitanceFarads);
        var rho = tau > 0 ? Math.Exp(-1 / (adc.SampleRateHertz * tau)) : 0;
        var worst = points.MaxBy(p => p.RmsVolts)!;
        var perKelvin = Math.Abs(model.At(worst.Celsius).VoltsPerKelvin);
        var averaging = AveragedConversions.Select(n =>
        {
            var correlated = Math.Sqrt(worst.SamplingRmsVolts * worst.SamplingRmsVolts / n + worst.FrontEndRmsVolts * worst.FrontEndRmsVolts * CorrelatedFactor(n, rho));
            return new AveragingGain(n, worst.RmsVolts / Math.Sqrt(n), correlated, correlated / perKelvin);
        }).ToList();
        var analysis = b.Subcircuit is null
            ? "noise analysis (adjoint)"
            : "noise analysis of your op-amp subcircuit by the check's engine (the total only; the switch's share taken as its kT/C)";
        var method = FormattableString.Invariant(
            $"{analysis} at the sampling capacitor with the switch closed, {EngineeringFormat.Format(FromHertz, UnitKind.Hertz, 3)} to {EngineeringFormat.Format(to, UnitKind.Hertz, 3)}; averaging: kT/C uncorrelated, front end correlated as e^(−T_s/τ), τ = {EngineeringFormat.Format(tau, UnitKind.Second, 3)}");
        return new NoiseReport(FromHertz, to, points, tau, rho, averaging, method);
    }

    /// <summary>Variance of the mean of N samples of a process with correlation ρ^k at lag k, over the variance of one.</summary>
    public static double CorrelatedFactor(int n, double rho) => Noise.ReadingNoiseAnalysis.CorrelatedFactor(n, rho);
}
