using ThermVerify.Quantities;
using ThermVerify.Sensors;

namespace ThermVerify.Tests.Simulation;

/// <summary>
/// The Beta (B-parameter) model written out independently for the engine tests:
/// R(T) = R0·exp(β·(1/T − 1/T0)), T in kelvin (Steinhart & Hart 1968 family; the B-parameter form is
/// common practice, no source).
/// </summary>
internal sealed class ClosedFormBetaSensor(double r0Ohms, double beta, double t0Celsius = 25) : ISensorModel
{
    public string Description => $"Beta test sensor R0={r0Ohms} β={beta}";

    public TemperatureRange ValidRange => new(-80, 200);

    public double ResistanceOhms(double temperatureCelsius)
    {
        if (!ValidRange.Contains(temperatureCelsius))
            throw new SensorRangeException($"{temperatureCelsius} °C is outside {ValidRange}.");
        return r0Ohms * Math.Exp(beta * (1 / PhysicalConstants.ToKelvin(temperatureCelsius) - 1 / PhysicalConstants.ToKelvin(t0Celsius)));
    }

    public double TemperatureCelsius(double resistanceOhms) =>
        PhysicalConstants.ToCelsius(1 / (1 / PhysicalConstants.ToKelvin(t0Celsius) + Math.Log(resistanceOhms / r0Ohms) / beta));

    public double SlopeOhmsPerKelvin(double temperatureCelsius) =>
        -beta / Math.Pow(PhysicalConstants.ToKelvin(temperatureCelsius), 2) * ResistanceOhms(temperatureCelsius);
}
