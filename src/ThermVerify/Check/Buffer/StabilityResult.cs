namespace ThermVerify.Check.Buffer;

/// <summary>The buffer's loop gain at one temperature with its real load, and the margins read from it.</summary>
public sealed record StabilityResult(
    double Celsius,
    double? CrossoverHertz,
    double? PhaseMarginDegrees,
    double? PhaseCrossoverHertz,
    double? GainMarginDecibels,
    IReadOnlyList<double> FrequenciesHertz,
    IReadOnlyList<double> MagnitudeDb,
    IReadOnlyList<double> PhaseDegrees,
    SinglePoleLoop ClosedForm)
{
    /// <summary>The hand calculation's phase margin for the same load (see <see cref="SinglePoleLoop"/>).</summary>
    public double ClosedFormPhaseMarginDegrees => ClosedForm.PhaseMarginDegrees;
}

/// <summary>The closed-loop step: the second view of stability, from a transient. <see cref="SettlingSeconds"/> is ∞ when the output is still outside 1 % when the run ends.</summary>
public sealed record StepResponse(
    double StepVolts,
    double OvershootPercent,
    double PeakSeconds,
    double SettlingSeconds,
    string Node,
    IReadOnlyList<double> TimesSeconds,
    IReadOnlyList<double> Volts);

/// <summary>Everything about the buffer's stability: the loop at each temperature looked at, the step, and the isolation resistor for 60°.</summary>
public sealed record StabilityReport(
    IReadOnlyList<StabilityResult> Loops,
    StepResponse? Step,
    double MinimumPhaseMarginDegrees,
    double TargetPhaseMarginDegrees,
    double? IsolationForTargetOhms,
    double? ClosedFormIsolationForTargetOhms,
    string Method)
{
    /// <summary>The loop with the smallest phase margin (a loop that never crosses unity counts as the best).</summary>
    public StabilityResult Worst => Loops.MinBy(l => l.PhaseMarginDegrees ?? double.PositiveInfinity)!;

    public bool Passed => Worst.PhaseMarginDegrees is not { } pm || pm >= MinimumPhaseMarginDegrees;
}
