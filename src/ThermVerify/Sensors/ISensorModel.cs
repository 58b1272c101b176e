namespace ThermVerify.Sensors;

/// <summary>
/// A resistive temperature sensor: the only contract the rest of thermverify relies on.
/// Temperatures are in °C, resistances in Ω. Outside <see cref="ValidRange"/> a model throws
/// <see cref="SensorRangeException"/> rather than extrapolate silently.
/// </summary>
public interface ISensorModel
{
    /// <summary>One line naming the model and its parameters, for reports.</summary>
    string Description { get; }

    TemperatureRange ValidRange { get; }

    double ResistanceOhms(double temperatureCelsius);

    double TemperatureCelsius(double resistanceOhms);

    /// <summary>dR/dT in Ω/K at the given temperature.</summary>
    double SlopeOhmsPerKelvin(double temperatureCelsius);
}

/// <summary>A closed temperature interval in °C.</summary>
public readonly record struct TemperatureRange(double MinCelsius, double MaxCelsius)
{
    public bool Contains(double celsius) => celsius >= MinCelsius && celsius <= MaxCelsius;

    public override string ToString() => FormattableString.Invariant($"{MinCelsius:0.###} °C to {MaxCelsius:0.###} °C");
}

/// <summary>A sensor model was asked about a temperature or resistance outside its valid range.</summary>
public sealed class SensorRangeException(string message) : Exception(message);
