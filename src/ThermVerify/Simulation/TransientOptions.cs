namespace ThermVerify.Simulation;

/// <summary>
/// Settings of a transient analysis. The step is chosen so that the estimated local truncation error of
/// every integrated state (capacitor voltage, inductor current) stays within
/// TruncationErrorFactor·(RelativeTolerance·|x| + VoltageToleranceVolts or CurrentToleranceAmperes),
/// the same form as SPICE's trtol/reltol/vntol/abstol (Nagel 1975, from memory). Defaults are tighter than
/// SPICE's (reltol 1e-3, trtol 7) because sampled voltages are judged in fractions of an LSB, and the
/// error estimate here (divided differences of the states) is not inflated, so the factor is 1.
/// </summary>
internal sealed record TransientOptions
{
    /// <summary>End of the run, in seconds from t = 0 (absolute, also when continuing from a state).</summary>
    public required double StopTimeSeconds { get; init; }

    /// <summary>Largest step; 0 means (stop − start)/50, as SPICE.</summary>
    public double MaxStepSeconds { get; init; }

    /// <summary>First step; 0 means a thousandth of the distance to the first stop.</summary>
    public double InitialStepSeconds { get; init; }

    /// <summary>Below this step the run gives up with a <see cref="ConvergenceException"/>.</summary>
    public double MinStepSeconds { get; init; } = 1e-18;

    /// <summary>Trapezoidal, switching to Gear-2 if it rings (<see cref="IntegrationMethod.Automatic"/>), unless chosen.</summary>
    public IntegrationMethod Method { get; init; } = IntegrationMethod.Automatic;

    public double RelativeTolerance { get; init; } = 1e-6;

    public double VoltageToleranceVolts { get; init; } = 1e-9;

    public double CurrentToleranceAmperes { get; init; } = 1e-12;

    /// <summary>SPICE's trtol: a multiplier of the truncation-error tolerance.</summary>
    public double TruncationErrorFactor { get; init; } = 1;

    /// <summary>Start from capacitor initial voltages (and inductor initial currents) instead of the free operating point.</summary>
    public bool UseInitialConditions { get; init; }

    /// <summary>Fixed step without error control (still shortened to land on breakpoints); for convergence-order studies.</summary>
    public double? FixedStepSeconds { get; init; }

    /// <summary>
    /// The accuracy the caller needs of the voltages it reads, where an engine approximates a nonlinearity instead of
    /// stepping through it (the built-in engine's exact propagation takes an op-amp as linear while its departure from
    /// linear stays within this); null for the engine's own default. Time stepping ignores it.
    /// </summary>
    public double? AccuracyVolts { get; init; }

    /// <summary>Times that must be exact solution points (e.g. the end of each acquisition); not discontinuities.</summary>
    public IReadOnlyList<double> OutputTimesSeconds { get; init; } = [];

    internal void Validate()
    {
        static void Check(bool ok, string message)
        {
            if (!ok)
                throw new ArgumentException(message);
        }
        Check(double.IsFinite(StopTimeSeconds) && StopTimeSeconds > 0, $"Transient stop time {StopTimeSeconds} s must be finite and positive.");
        Check(MaxStepSeconds >= 0 && InitialStepSeconds >= 0, "Transient max and initial steps must not be negative (0 = automatic).");
        Check(MinStepSeconds > 0, "Transient minimum step must be positive.");
        Check(RelativeTolerance > 0 && VoltageToleranceVolts > 0 && CurrentToleranceAmperes > 0 && TruncationErrorFactor > 0,
            "Transient tolerances must be positive.");
        Check(AccuracyVolts is null || (AccuracyVolts > 0 && double.IsFinite(AccuracyVolts.Value)), "The transient's accuracy must be positive and finite.");
        Check(FixedStepSeconds is null or > 0, "A fixed transient step must be positive.");
        Check(OutputTimesSeconds.All(double.IsFinite), "Transient output times must be finite.");
    }
}
