namespace ThermVerify.Sensors;

/// <summary>NTC thermistor, Steinhart–Hart: 1/T = A + B ln R + C (ln R)³ (+ D (ln R)² in the 4-term form).</summary>
public sealed class SteinhartHartThermistor : ISensorModel
{
    public SteinhartHartThermistor(double a, double b, double c, double d = 0, TemperatureRange? validRange = null)
        => throw new NotImplementedException();

    public double A => throw new NotImplementedException();
    public double B => throw new NotImplementedException();
    public double C => throw new NotImplementedException();
    /// <summary>Coefficient of the squared term; 0 in the classic 3-term form.</summary>
    public double D => throw new NotImplementedException();
    public string Description => throw new NotImplementedException();
    public TemperatureRange ValidRange => throw new NotImplementedException();
    public double ResistanceOhms(double temperatureCelsius) => throw new NotImplementedException();
    public double TemperatureCelsius(double resistanceOhms) => throw new NotImplementedException();
    public double SlopeOhmsPerKelvin(double temperatureCelsius) => throw new NotImplementedException();
}
