namespace ThermVerify.Circuits.Spice;

/// <summary>One analysis of a SPICE deck.</summary>
internal abstract record SpiceAnalysis;

/// <summary>
/// <c>.dc temp</c> from <see cref="StartCelsius"/> in steps of <see cref="StepKelvin"/>, <see cref="Points"/> points.
/// The stop value is written half a step beyond the last point, because SPICE accumulates the step and may otherwise
/// drop the last point; read only the first <see cref="Points"/> values.
/// </summary>
internal sealed record DcTemperatureSweep(double StartCelsius, double StepKelvin, int Points) : SpiceAnalysis
{
    /// <summary>An evenly spaced list (to 1e-9 of a step) as a sweep; anything else cannot be one <c>.dc</c> line.</summary>
    public static DcTemperatureSweep From(IReadOnlyList<double> temperaturesCelsius)
    {
        if (temperaturesCelsius.Count == 0)
            throw new ArgumentException("A temperature sweep needs at least one temperature.");
        if (temperaturesCelsius.Count == 1)
            return new(temperaturesCelsius[0], 1, 1);
        var step = (temperaturesCelsius[^1] - temperaturesCelsius[0]) / (temperaturesCelsius.Count - 1);
        for (var i = 0; i < temperaturesCelsius.Count; i++)
            if (Math.Abs(temperaturesCelsius[i] - (temperaturesCelsius[0] + i * step)) > 1e-9 * Math.Abs(step) || step <= 0)
                throw new EngineUnsupportedException(
                    $"SPICE's .dc temp sweeps evenly spaced, rising temperatures; temperature #{i + 1} ({temperaturesCelsius[i]} °C) breaks the spacing.");
        return new(temperaturesCelsius[0], step, temperaturesCelsius.Count);
    }
}

/// <summary>
/// <c>.dc</c> of an independent source's DC value from <see cref="Start"/> in steps of <see cref="Step"/>,
/// <see cref="Points"/> points; the stop value is written half a step beyond the last point, as for
/// <see cref="DcTemperatureSweep"/>.
/// </summary>
internal sealed record DcSourceSweep(string Source, double Start, double Step, int Points) : SpiceAnalysis;

/// <summary><c>.tran</c> to <see cref="StopSeconds"/> with at most <see cref="MaxStepSeconds"/> per step.</summary>
internal sealed record TransientSweep(double StopSeconds, double MaxStepSeconds) : SpiceAnalysis
{
    /// <summary>SPICE's relative tolerance for this deck (also sets the truncation-error control).</summary>
    public double RelativeTolerance { get; init; } = 1e-6;

    public double VoltageToleranceVolts { get; init; } = 1e-9;

    /// <summary>Windows in which the engine must take evenly spaced steps (see <see cref="StepGuard"/>).</summary>
    public IReadOnlyList<StepGuard> StepGuards { get; init; } = [];
}

/// <summary><c>.op</c>: the DC operating point at the circuit's temperature.</summary>
internal sealed record OperatingPointAnalysis : SpiceAnalysis;

/// <summary><c>.ac dec</c> from <see cref="StartHertz"/> to <see cref="StopHertz"/>.</summary>
internal sealed record AcSweep(double StartHertz, double StopHertz, int PointsPerDecade) : SpiceAnalysis;

/// <summary><c>.noise</c> at <see cref="OutputNode"/> (against ground), input referred to <see cref="InputSource"/>.</summary>
internal sealed record NoiseSweep(string OutputNode, string InputSource, double StartHertz, double StopHertz, int PointsPerDecade) : SpiceAnalysis;

/// <summary>
/// Forces <see cref="Points"/> evenly spaced time points into the window [start, start + window) of every period:
/// written as zero-valued PULSE current sources, whose corners SPICE takes as breakpoints. This caps the step inside
/// short windows (an acquisition) without capping it everywhere, and costs no matrix rows.
/// </summary>
internal sealed record StepGuard(double StartSeconds, double WindowSeconds, double PeriodSeconds, int Points)
{
    /// <summary>
    /// Points per closed switch window that bring ngspice's samples after a charge-sharing step to about 3 µV of the
    /// two-capacitor closed form; its own step control leaves 0.5 mV there, and tighter tolerances make it give up at
    /// the switch edges (measured with ngspice 39; docs/ngspice.md).
    /// </summary>
    public const int PointsPerSwitchWindow = 1000;

    /// <summary>A guard on the closed window of every periodically driven switch of the circuit.</summary>
    public static IReadOnlyList<StepGuard> ForSwitches(Circuit circuit) =>
        [.. circuit.Elements.OfType<TimedSwitch>().Select(s => s.Schedule).OfType<PeriodicSchedule>()
            .Select(p => new StepGuard(p.DelaySeconds, p.ClosedSeconds, p.PeriodSeconds, PointsPerSwitchWindow))];
}
