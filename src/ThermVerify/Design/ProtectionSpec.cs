namespace ThermVerify.Design;

/// <summary>
/// Protection parts and parasitics at the converter's input. Clamp diodes at the ADC pin (one to the clamp rail, one to
/// ground), whose reverse leakage doubles every few kelvin at the diodes' own temperature; and the insulation of the
/// sensor's cable or board as a resistance from the sensor's signal node to a fixed potential. The series protection
/// resistor is the filter's series resistor ([filter] series_resistor), which sits between the sensor and the pin.
/// </summary>
public sealed record ProtectionSpec
{
    /// <summary>
    /// Reverse leakage of one clamp diode at <see cref="ClampLeakageCelsius"/>, amperes; zero: no clamp diodes. Without
    /// a sign the net leakage is a bound (one diode leaking at this value, the other not, either way); a positive value
    /// written with its sign is the upper diode's (into the pin), a negative one the lower diode's (out of the pin).
    /// </summary>
    public double ClampLeakageAmperes { get; init; }
    /// <summary>Written with a sign: taken at that sign; without one a bound (<see cref="SignWritten"/>).</summary>
    public bool ClampLeakageSigned { get; init; }
    /// <summary>Temperature at which <see cref="ClampLeakageAmperes"/> is given.</summary>
    public double ClampLeakageCelsius { get; init; } = DesignDefaults.PinLeakageCelsius;
    /// <summary>The leakage doubles every this many kelvin (common practice for silicon junctions, no source).</summary>
    public double ClampDoublingKelvin { get; init; } = DesignDefaults.LeakageDoublingKelvin;
    /// <summary>The rail the upper diode's cathode goes to; null: the converter's full scale (its reference).</summary>
    public double? ClampRailVolts { get; init; }
    /// <summary>The diodes' own temperature; null: the board temperature, or the swept one without a board temperature.</summary>
    public double? ClampCelsius { get; init; }

    /// <summary>Lowest insulation resistance from the sensor's signal node to <see cref="InsulationToVolts"/>; null: none.</summary>
    public double? InsulationOhms { get; init; }
    /// <summary>The potential the insulation leaks to (0 V: ground or a shield; a supply or a heater wire in the same cable).</summary>
    public double InsulationToVolts { get; init; }

    public bool HasClamps => ClampLeakageAmperes != 0;

    /// <summary>One diode's leakage at <paramref name="celsius"/>, magnitude: it doubles every <see cref="ClampDoublingKelvin"/>.</summary>
    public double ClampLeakageAmperesAt(double celsius) =>
        Quantities.DoublingLaw.At(Math.Abs(ClampLeakageAmperes), ClampLeakageCelsius, ClampDoublingKelvin, celsius);
}
