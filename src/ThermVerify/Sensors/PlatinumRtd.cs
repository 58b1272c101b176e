namespace ThermVerify.Sensors;

/// <summary>Platinum RTD per IEC 60751 (Callendar–Van Dusen), any R0; valid −200 °C to 850 °C.</summary>
public sealed class PlatinumRtd : ISensorModel
{
    public const double IecA = 3.9083e-3;
    public const double IecB = -5.775e-7;
    public const double IecC = -4.183e-12;

    public PlatinumRtd(double r0Ohms, double a = IecA, double b = IecB, double c = IecC) => throw new NotImplementedException();

    public double R0Ohms => throw new NotImplementedException();
    public string Description => throw new NotImplementedException();
    public TemperatureRange ValidRange => throw new NotImplementedException();
    public double ResistanceOhms(double temperatureCelsius) => throw new NotImplementedException();
    public double TemperatureCelsius(double resistanceOhms) => throw new NotImplementedException();
    public double SlopeOhmsPerKelvin(double temperatureCelsius) => throw new NotImplementedException();
}
