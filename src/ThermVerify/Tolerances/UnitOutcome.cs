namespace ThermVerify.Tolerances;

/// <summary>
/// What one unit reports over the check grid: the error of the firmware's reading (quantised, as the firmware sees
/// it, and unquantised for sensitivities), the self-heating included in it, and where the sampling was simulated
/// with the unit's own parts.
/// </summary>
internal sealed record UnitOutcome(
    double[] ErrorKelvin,
    double[] UnquantisedErrorKelvin,
    double[] SelfHeatingKelvin,
    int WorstIndex,
    bool WithinBudget,
    double? SettlingSimulatedCelsius)
{
    public double WorstErrorKelvin => ErrorKelvin[WorstIndex];

    /// <summary>A delta-sigma unit's first reading used after a channel switch, in K at <see cref="SettlingSimulatedCelsius"/>; null when not simulated.</summary>
    public double? ChannelSwitchKelvin { get; init; }
}
