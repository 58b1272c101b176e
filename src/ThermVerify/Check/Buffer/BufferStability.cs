using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Simulation;

namespace ThermVerify.Check.Buffer;

/// <summary>
/// Stability of the buffer into its real load, from the AC analysis. The loop is broken by Bode's return ratio at
/// the op-amp's input transconductance (<see cref="LoopGain"/>): the controlled current is replaced by a unit
/// injection and T = −g·v_d is read back, so nothing is cut and every loading (r_o, isolation and filter
/// resistors, reservoir, pin and sampling capacitance, the feedback network) stays as it is. The margins come from
/// the sweep; the single-pole hand calculation is given beside them.
/// </summary>
internal static class BufferStability
{
    public const double TargetPhaseMarginDegrees = 60;

    public const string Method =
        "AC analysis of the front end during an acquisition (switch closed); loop broken by Bode's return ratio at the op-amp's " +
        "input transconductance (unit current injected in place of g·vd, T = −g·vd), so no loading changes";

    private const int PointsPerDecade = 40;

    public static StabilityResult Loop(FrontEndDesign design, double celsius, ICheckEngine? engine = null)
    {
        var buffer = BufferCircuits.Require(design);
        var circuit = BufferCircuits.Acquiring(design, celsius);
        var sweep = FrequencySweep.Logarithmic(Math.Max(1e-3, buffer.GainBandwidthHertz * 1e-7), buffer.GainBandwidthHertz * 1e3, PointsPerDecade);
        // The design's own subcircuit is a black box only a SPICE engine runs: its loop is measured by injection.
        var loop = buffer.Subcircuit is null
            ? LoopGain.Run(circuit, BufferCircuits.OpAmpName, sweep)
            : SubcircuitBuffer.LoopGain(circuit, sweep, engine ?? BuiltInEngine.Instance);
        var phase = loop.PhaseDegrees;
        var magnitude = loop.MagnitudeDb;
        var (phaseCrossover, gainMargin) = GainMargin([.. loop.FrequenciesHertz], magnitude, phase);
        return new StabilityResult(celsius, loop.CrossoverHertz, loop.PhaseMarginDegrees, phaseCrossover, gainMargin,
            [.. loop.FrequenciesHertz], magnitude, phase, ClosedForm(design));
    }

    /// <summary>The hand calculation for this design's load.</summary>
    public static SinglePoleLoop ClosedForm(FrontEndDesign design)
    {
        var b = BufferCircuits.Require(design);
        var load = design.Filter.ReservoirCapacitorFarads + design.Adc.PinCapacitanceFarads + design.Adc.SamplingCapacitanceFarads;
        return new SinglePoleLoop(b.GainBandwidthHertz, OpAmpOhms(b), b.IsolationResistorOhms + design.Filter.SeriesResistorOhms, load, 1 / b.Gain);
    }

    /// <summary>The loop at the ends and the middle of the check range, the step response, and the isolation resistor for 60° when the margin is lower.</summary>
    public static StabilityReport Run(FrontEndDesign design, bool searchRemedy = true, ICheckEngine? engine = null)
    {
        var buffer = BufferCircuits.Require(design);
        var range = design.Check.Range;
        double[] temperatures = [range.MinCelsius, 0.5 * (range.MinCelsius + range.MaxCelsius), range.MaxCelsius];
        var loops = temperatures.Distinct().Select(t => Loop(design, t, engine)).ToList();
        var worst = loops.MinBy(l => l.PhaseMarginDegrees ?? double.PositiveInfinity)!;
        double? isolation = null, closedFormIsolation = null;
        if (searchRemedy && worst.PhaseMarginDegrees is { } pm && pm < TargetPhaseMarginDegrees)
        {
            isolation = IsolationFor(design, TargetPhaseMarginDegrees, worst.Celsius, engine);
            var cf = ClosedForm(design);
            closedFormIsolation = SinglePoleLoop.IsolationFor(TargetPhaseMarginDegrees, cf.GainBandwidthHertz, cf.OutputOhms,
                design.Filter.SeriesResistorOhms, cf.LoadFarads, cf.FeedbackFactor);
        }
        StepResponse? step = null;
        try
        {
            step = BufferStep.Run(design, worst.CrossoverHertz, engine);
        }
        catch (SimulationException)
        {
            // An oscillating loop can defeat the transient; the loop gain above already tells the verdict.
        }
        return new StabilityReport(loops, step, buffer.MinimumPhaseMarginDegrees, TargetPhaseMarginDegrees, isolation, closedFormIsolation,
            buffer.Subcircuit is null ? Method : SubcircuitBuffer.Method);
    }

    /// <summary>
    /// The smallest isolation resistor (outside the loop, between the op-amp and the filter) that gives the target
    /// phase margin, by bisection on the simulated loop gain; null when none up to 1 MΩ does (a second pole limits).
    /// </summary>
    public static double? IsolationFor(FrontEndDesign design, double targetDegrees, double celsius, ICheckEngine? engine = null)
    {
        double Margin(double ohms) =>
            Loop(BufferCircuits.WithBuffer(design, b => b with { IsolationResistorOhms = ohms }), celsius, engine).PhaseMarginDegrees ?? 90;
        return MonotoneSearch.SmallestPassing(1e-2, 1e6, r => Margin(r) >= targetDegrees, relativePrecision: 1e-3);
    }

    /// <summary>The op-amp's output resistance as the macro-model uses it.</summary>
    internal static double OpAmpOhms(BufferSpec b) => BufferStage.OpAmpFor(b, "a", "b", "c", null).OutputResistanceOhms;

    /// <summary>First frequency where the unwrapped phase of T reaches −180°, and −|T| in dB there (linear in log f between sweep points).</summary>
    private static (double? Hertz, double? MarginDb) GainMargin(double[] f, double[] magnitudeDb, double[] phase)
    {
        for (var k = 1; k < f.Length; k++)
        {
            if (phase[k - 1] > -180 && phase[k] <= -180)
            {
                var u = (-180 - phase[k - 1]) / (phase[k] - phase[k - 1]);
                var hertz = Math.Exp(Math.Log(f[k - 1]) + u * (Math.Log(f[k]) - Math.Log(f[k - 1])));
                var db = magnitudeDb[k - 1] + u * (magnitudeDb[k] - magnitudeDb[k - 1]);
                return (hertz, -db);
            }
        }
        return (null, null);
    }
}
