using System.Globalization;
using static ThermVerify.Quantities.PhysicalConstants;
using ThermVerify.Quantities;

namespace ThermVerify.Sensors;

/// <summary>NTC thermistor, Beta (B-parameter) model: 1/T = 1/T0 + ln(R/R0)/β.</summary>
/// <remarks>
/// β is used exactly as given with R0 at T0, whatever pair of temperatures it was specified between;
/// the pair only labels β in <see cref="Description"/> (a B25/85 and a B25/50 of the same part differ,
/// and the model cannot know which is closer to the part's true curve).
/// </remarks>
public sealed class BetaThermistor : ISensorModel
{
    /// <summary>Range used when none is given (common practice for epoxy-coated NTCs, no source).</summary>
    public static readonly TemperatureRange DefaultValidRange = new(-55, 155);

    private readonly double _inverseT0;
    private readonly double _minOhms;
    private readonly double _maxOhms;

    /// <param name="r0Ohms">Resistance at <paramref name="t0Celsius"/> (R25 when t0 = 25 °C).</param>
    /// <param name="beta">β in K, e.g. B25/85.</param>
    /// <param name="betaFromCelsius">Lower temperature of the pair β was specified between (for the description).</param>
    /// <param name="betaToCelsius">Upper temperature of that pair.</param>
    public BetaThermistor(double r0Ohms, double beta, double t0Celsius = 25, TemperatureRange? validRange = null,
        double betaFromCelsius = 25, double betaToCelsius = 85)
    {
        R0Ohms = RangeGuard.RequirePositiveFinite(r0Ohms, "R0 of a Beta-model thermistor", nameof(r0Ohms));
        Beta = RangeGuard.RequirePositiveFinite(beta, "β of an NTC thermistor (in K)", nameof(beta));
        if (!double.IsFinite(t0Celsius) || t0Celsius <= -ZeroCelsiusInKelvin)
            throw new ArgumentOutOfRangeException(nameof(t0Celsius), t0Celsius, "T0 must be a finite temperature above −273.15 °C.");
        T0Celsius = t0Celsius;
        BetaFromCelsius = betaFromCelsius;
        BetaToCelsius = betaToCelsius;
        ValidRange = RangeGuard.Validate(validRange ?? DefaultValidRange, nameof(validRange));
        _inverseT0 = 1 / ToKelvin(t0Celsius);
        _minOhms = Resistance(ValidRange.MaxCelsius);
        _maxOhms = Resistance(ValidRange.MinCelsius);
    }

    /// <summary>"Beta from 2 points": the β that passes exactly through both; R0 and T0 are taken from <paramref name="p1"/>.</summary>
    public static BetaThermistor FromTwoPoints(TablePoint p1, TablePoint p2, TemperatureRange? validRange = null) =>
        SensorFitting.BetaFromTwoPoints(p1, p2, validRange).Model;

    /// <summary>β between two temperatures from the resistances there: ln(R1/R2)/(1/T1 − 1/T2).</summary>
    public static double BetaBetween(TablePoint p1, TablePoint p2) =>
        Math.Log(p1.Ohms / p2.Ohms) / (1 / ToKelvin(p1.Celsius) - 1 / ToKelvin(p2.Celsius));

    public double R0Ohms { get; }
    public double Beta { get; }
    public double T0Celsius { get; }
    public double BetaFromCelsius { get; }
    public double BetaToCelsius { get; }

    public string Description => string.Create(CultureInfo.InvariantCulture,
        $"NTC Beta model: R0 = {EngineeringFormat.Format(R0Ohms, UnitKind.Ohm, 6)} at {T0Celsius:0.###} °C, β{BetaFromCelsius:0.###}/{BetaToCelsius:0.###} = {Beta:G6} K, valid {ValidRange}");

    public TemperatureRange ValidRange { get; }

    public double ResistanceOhms(double temperatureCelsius)
    {
        RangeGuard.CheckTemperature(temperatureCelsius, ValidRange, this);
        return Resistance(temperatureCelsius);
    }

    public double TemperatureCelsius(double resistanceOhms)
    {
        RangeGuard.CheckResistance(resistanceOhms, _minOhms, _maxOhms, ValidRange, this);
        return ToCelsius(1 / (_inverseT0 + Math.Log(resistanceOhms / R0Ohms) / Beta));
    }

    public double SlopeOhmsPerKelvin(double temperatureCelsius)
    {
        RangeGuard.CheckTemperature(temperatureCelsius, ValidRange, this);
        var kelvin = ToKelvin(temperatureCelsius);
        return -Beta * Resistance(temperatureCelsius) / (kelvin * kelvin);
    }

    private double Resistance(double celsius) => R0Ohms * Math.Exp(Beta * (1 / ToKelvin(celsius) - _inverseT0));
}
