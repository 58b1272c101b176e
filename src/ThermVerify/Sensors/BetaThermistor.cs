namespace ThermVerify.Sensors;

/// <summary>NTC thermistor, Beta (B-parameter) model: 1/T = 1/T0 + ln(R/R0)/β.</summary>
public sealed class BetaThermistor : ISensorModel
{
    /// <param name="r0Ohms">Resistance at <paramref name="t0Celsius"/> (R25 when t0 = 25 °C).</param>
    /// <param name="beta">β in K, e.g. B25/85.</param>
    /// <param name="betaFromCelsius">Lower temperature of the pair β was specified between (for the description).</param>
    /// <param name="betaToCelsius">Upper temperature of that pair.</param>
    public BetaThermistor(double r0Ohms, double beta, double t0Celsius = 25, TemperatureRange? validRange = null,
        double betaFromCelsius = 25, double betaToCelsius = 85) => throw new NotImplementedException();

    public double R0Ohms => throw new NotImplementedException();
    public double Beta => throw new NotImplementedException();
    public double T0Celsius => throw new NotImplementedException();
    public string Description => throw new NotImplementedException();
    public TemperatureRange ValidRange => throw new NotImplementedException();
    public double ResistanceOhms(double temperatureCelsius) => throw new NotImplementedException();
    public double TemperatureCelsius(double resistanceOhms) => throw new NotImplementedException();
    public double SlopeOhmsPerKelvin(double temperatureCelsius) => throw new NotImplementedException();
}
