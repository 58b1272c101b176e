namespace ThermVerify.Design;

/// <summary>
/// Passive parts between the divider (or buffer) and the ADC pin. Zero means the part is absent:
/// no series resistor is a short, no reservoir capacitor is an open.
/// </summary>
public sealed record FilterSpec
{
    public double SeriesResistorOhms { get; init; }
    public double ReservoirCapacitorFarads { get; init; }

    public static FilterSpec None { get; } = new();
}
