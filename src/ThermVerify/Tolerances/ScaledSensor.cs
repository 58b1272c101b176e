using ThermVerify.Sensors;

namespace ThermVerify.Tolerances;

/// <summary>A sensor whose every resistance is the nominal one times a factor (a resistance tolerance).</summary>
internal sealed class ScaledSensor(ISensorModel nominal, double factor) : ISensorModel
{
    public string Description => FormattableString.Invariant($"{nominal.Description}, resistance × {factor:G6}");

    public TemperatureRange ValidRange => nominal.ValidRange;

    public double ResistanceOhms(double temperatureCelsius) => factor * nominal.ResistanceOhms(temperatureCelsius);

    public double TemperatureCelsius(double resistanceOhms) => nominal.TemperatureCelsius(resistanceOhms / factor);

    public double SlopeOhmsPerKelvin(double temperatureCelsius) => factor * nominal.SlopeOhmsPerKelvin(temperatureCelsius);
}
