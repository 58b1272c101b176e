using System.Globalization;
using static ThermVerify.Quantities.PhysicalConstants;

namespace ThermVerify.Sensors;

/// <summary>NTC thermistor, Steinhart–Hart: 1/T = A + B ln R + C (ln R)³ (+ D (ln R)² in the 4-term form).</summary>
/// <remarks>
/// J. S. Steinhart, S. R. Hart, "Calibration curves for thermistors", Deep-Sea Research 15 (1968) 497–503.
/// The coefficients are checked once: 1/T must rise strictly with ln R across the valid range, otherwise
/// R(T) would not be single-valued and the inverse would be a guess.
/// </remarks>
public sealed class SteinhartHartThermistor : ISensorModel
{
    /// <summary>Range used when none is given (common practice for epoxy-coated NTCs, no source).</summary>
    public static readonly TemperatureRange DefaultValidRange = new(-55, 155);

    private readonly double _minOhms;
    private readonly double _maxOhms;

    public SteinhartHartThermistor(double a, double b, double c, double d = 0, TemperatureRange? validRange = null)
    {
        if (!double.IsFinite(a) || !double.IsFinite(b) || !double.IsFinite(c) || !double.IsFinite(d))
            throw new ArgumentException("Steinhart–Hart coefficients A, B, C, D must all be finite numbers.");
        A = a; B = b; C = c; D = d;
        ValidRange = RangeGuard.Validate(validRange ?? DefaultValidRange, nameof(validRange));

        double lnRLow, lnRHigh;
        try
        {
            lnRLow = SteinhartHartInverse.LnResistance(a, b, c, d, 1 / ToKelvin(ValidRange.MaxCelsius));
            lnRHigh = SteinhartHartInverse.LnResistance(a, b, c, d, 1 / ToKelvin(ValidRange.MinCelsius));
        }
        catch (ArithmeticException e)
        {
            throw new ArgumentException(NotMonotoneMessage() + " " + e.Message, e);
        }
        if (!(lnRLow < lnRHigh) || !SteinhartHartInverse.SlopeIsPositive(b, c, d, lnRLow, lnRHigh))
            throw new ArgumentException(NotMonotoneMessage());
        _minOhms = Math.Exp(lnRLow);
        _maxOhms = Math.Exp(lnRHigh);
    }

    public double A { get; }
    public double B { get; }
    public double C { get; }
    /// <summary>Coefficient of the squared term; 0 in the classic 3-term form.</summary>
    public double D { get; }

    public string Description => FormattableString.Invariant($"NTC Steinhart–Hart model: A = {A:G10}, B = {B:G10}, C = {C:G10}")
        + (D != 0 ? FormattableString.Invariant($", D = {D:G10}") : "") + $", valid {ValidRange}";

    public TemperatureRange ValidRange { get; }

    public double ResistanceOhms(double temperatureCelsius)
    {
        RangeGuard.CheckTemperature(temperatureCelsius, ValidRange, this);
        return Math.Exp(SteinhartHartInverse.LnResistance(A, B, C, D, 1 / ToKelvin(temperatureCelsius)));
    }

    public double TemperatureCelsius(double resistanceOhms)
    {
        RangeGuard.CheckResistance(resistanceOhms, _minOhms, _maxOhms, ValidRange, this);
        return ToCelsius(1 / InverseKelvin(Math.Log(resistanceOhms)));
    }

    public double SlopeOhmsPerKelvin(double temperatureCelsius)
    {
        var ohms = ResistanceOhms(temperatureCelsius);
        var kelvin = ToKelvin(temperatureCelsius);
        var x = Math.Log(ohms);
        // 1/T = f(x) with x = ln R, so dR/dT = R·dx/dT = −R / (T² f'(x)).
        return -ohms / (kelvin * kelvin * (B + x * (2 * D + 3 * C * x)));
    }

    private double InverseKelvin(double x) => A + x * (B + x * (D + x * C));

    private string NotMonotoneMessage() => FormattableString.Invariant(
        $"Steinhart–Hart coefficients A = {A:G10}, B = {B:G10}, C = {C:G10}, D = {D:G10} do not give a resistance that falls strictly with temperature over {ValidRange}; check the coefficients' order and signs or narrow the valid range.");
}
