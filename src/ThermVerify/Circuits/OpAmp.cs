using ThermVerify.Circuits.Spice;

namespace ThermVerify.Circuits;

/// <summary>
/// Operational-amplifier macro-model (voltage feedback, single supply or split, ground-referenced):
/// input offset in series with the non-inverting input; bias currents into each input; a
/// transconductance stage into a dominant pole (DC gain <see cref="OpenLoopGain"/>, unity-gain frequency
/// <see cref="GainBandwidthHertz"/>), tanh-limited in transients so the pole capacitor charges at no more
/// than <see cref="SlewRateVoltsPerSecond"/>; an optional second pole; a smooth clamp to the output swing
/// limits; and <see cref="OutputResistanceOhms"/> in series with the output. The output stage is ideal
/// otherwise (no supply pins: the swing limits are absolute voltages). Inputs outside the common-mode
/// range are reported as warnings, not errors. Noise: input voltage and current noise densities, each
/// white with a 1/f corner, e²(f) = e_w²·(1 + f_c/f).
/// </summary>
internal sealed record OpAmp(string Name, string NonInverting, string Inverting, string Output) : Element(Name)
{
    public double OpenLoopGain { get; init; } = 1e5;

    public double GainBandwidthHertz { get; init; } = 1e6;

    public double? SecondPoleHertz { get; init; }

    public double OutputResistanceOhms { get; init; } = 50;

    /// <summary>Offset voltage in series with the non-inverting input (positive raises the output).</summary>
    public double InputOffsetVolts { get; init; }

    /// <summary>Current flowing into the non-inverting pin.</summary>
    public double NonInvertingBiasAmperes { get; init; }

    /// <summary>Current flowing into the inverting pin.</summary>
    public double InvertingBiasAmperes { get; init; }

    public double OutputLowVolts { get; init; } = double.NegativeInfinity;

    public double OutputHighVolts { get; init; } = double.PositiveInfinity;

    /// <summary>Width of the knee of the output clamp; 10 mV keeps the linear range exact to ~1e-10 V 0.25 V from a rail.</summary>
    public double OutputKneeVolts { get; init; } = 0.01;

    public double SlewRateVoltsPerSecond { get; init; } = double.PositiveInfinity;

    public double CommonModeLowVolts { get; init; } = double.NegativeInfinity;

    public double CommonModeHighVolts { get; init; } = double.PositiveInfinity;

    public double VoltageNoiseVoltsPerRootHertz { get; init; }

    public double VoltageNoiseCornerHertz { get; init; }

    public double CurrentNoiseAmperesPerRootHertz { get; init; }

    public double CurrentNoiseCornerHertz { get; init; }

    public override IReadOnlyList<string> Nodes => [NonInverting, Inverting, Output];

    internal override IEnumerable<(string A, string B)> DcPaths => [(Output, Circuit.Ground)];

    internal override IReadOnlyList<ExtraUnknown> ExtraUnknowns =>
        SecondPoleHertz is null
            ? [ExtraUnknown.Voltage($"{Name}#pole"), ExtraUnknown.Voltage($"{Name}#drive"), ExtraUnknown.Current($"I({Name})")]
            : [ExtraUnknown.Voltage($"{Name}#pole"), ExtraUnknown.Voltage($"{Name}#pole2"), ExtraUnknown.Voltage($"{Name}#drive"), ExtraUnknown.Current($"I({Name})")];

    internal override void Validate()
    {
        base.Validate();
        ElementChecks.DistinctNodes(this, NonInverting, Inverting);
        ElementChecks.Positive(this, OpenLoopGain, "open-loop gain");
        ElementChecks.Positive(this, GainBandwidthHertz, "gain-bandwidth");
        if (SecondPoleHertz is { } p2)
            ElementChecks.Positive(this, p2, "second pole");
        ElementChecks.Positive(this, OutputResistanceOhms, "output resistance");
        ElementChecks.Finite(this, InputOffsetVolts, "input offset");
        ElementChecks.Finite(this, NonInvertingBiasAmperes, "non-inverting bias current");
        ElementChecks.Finite(this, InvertingBiasAmperes, "inverting bias current");
        ElementChecks.Positive(this, OutputKneeVolts, "output knee");
        if (double.IsNaN(OutputLowVolts) || double.IsNaN(OutputHighVolts) || OutputLowVolts >= OutputHighVolts - 4 * OutputKneeVolts)
            throw new CircuitException($"{Describe}: output swing {OutputLowVolts} V to {OutputHighVolts} V is empty or narrower than the knee; give low < high.");
        if (double.IsNaN(SlewRateVoltsPerSecond) || SlewRateVoltsPerSecond <= 0)
            throw new CircuitException($"{Describe}: slew rate {SlewRateVoltsPerSecond} V/s must be positive (∞ for none).");
        if (double.IsNaN(CommonModeLowVolts) || double.IsNaN(CommonModeHighVolts) || CommonModeLowVolts >= CommonModeHighVolts)
            throw new CircuitException($"{Describe}: common-mode range {CommonModeLowVolts} V to {CommonModeHighVolts} V is empty; give low < high.");
        ElementChecks.NonNegative(this, VoltageNoiseVoltsPerRootHertz, "voltage noise");
        ElementChecks.NonNegative(this, VoltageNoiseCornerHertz, "voltage noise corner");
        ElementChecks.NonNegative(this, CurrentNoiseAmperesPerRootHertz, "current noise");
        ElementChecks.NonNegative(this, CurrentNoiseCornerHertz, "current noise corner");
    }

    internal override void WriteSpice(SpiceLines deck) => OpAmpSubcircuit.Write(this, deck);
}
