namespace ThermVerify.Simulation.Switched;

/// <summary>Settings of <see cref="ExactSwitchedTransient"/>.</summary>
internal sealed record ExactSwitchedOptions
{
    /// <summary>
    /// How far an op-amp's nonlinear characteristics may depart from their linear-region tangents and still count as
    /// linear, in volts: the slew-limiting stage's error referred to its input, the output clamp's error at its output
    /// (see <see cref="OpAmpLinearRegion"/>). 1 µV is below the time-stepping engine's own error at its default
    /// tolerances (about 2 µV on a sampling transient) and an eighth of 0.01 LSB at 12 bits on 3.3 V.
    /// Only circuits with an op-amp are checked.
    /// </summary>
    public double LinearityToleranceVolts { get; init; } = 1e-6;

    internal void Validate()
    {
        if (!(LinearityToleranceVolts > 0 && double.IsFinite(LinearityToleranceVolts)))
            throw new ArgumentException($"The linearity tolerance {LinearityToleranceVolts} V must be positive and finite, e.g. 1e-6.");
    }
}
