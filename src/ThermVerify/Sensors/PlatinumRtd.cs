using System.Globalization;
using ThermVerify.Quantities;

namespace ThermVerify.Sensors;

/// <summary>Platinum RTD per IEC 60751 (Callendar–Van Dusen), any R0; valid −200 °C to 850 °C.</summary>
/// <remarks>
/// R(t) = R0[1 + A t + B t² + C (t − 100) t³], with the C term only below 0 °C (IEC 60751, clause on the
/// temperature/resistance relationship). Above 0 °C the inverse is the quadratic root; below, Newton from
/// that root converges in a few steps because the C term is small there.
/// </remarks>
internal sealed class PlatinumRtd : ISensorModel
{
    public const double IecA = 3.9083e-3;
    public const double IecB = -5.775e-7;
    public const double IecC = -4.183e-12;

    /// <summary>The span IEC 60751 defines the relationship over.</summary>
    public static readonly TemperatureRange IecRange = new(-200, 850);

    private readonly double _minOhms;
    private readonly double _maxOhms;

    public PlatinumRtd(double r0Ohms, double a = IecA, double b = IecB, double c = IecC)
    {
        R0Ohms = RangeGuard.RequirePositiveFinite(r0Ohms, "R0 of a platinum RTD", nameof(r0Ohms));
        if (!double.IsFinite(a) || !double.IsFinite(b) || !double.IsFinite(c))
            throw new ArgumentException("Callendar–Van Dusen coefficients A, B, C must be finite numbers.");
        CoefficientA = a; CoefficientB = b; CoefficientC = c;
        // A resistance that does not rise throughout −200…850 °C would make T(R) ambiguous; a 1 K grid suffices
        // because the slope is a cubic in t whose shape cannot flip between neighbouring grid points for sane inputs.
        for (var t = IecRange.MinCelsius; t <= IecRange.MaxCelsius; t += 1)
            if (!(Slope(t) > 0))
                throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                    $"Callendar–Van Dusen coefficients A = {a:G6}, B = {b:G6}, C = {c:G6} do not give a resistance rising with temperature " +
                    $"at {t:0} °C; use the IEC 60751 values unless a calibration certificate gives others."));
        _minOhms = Resistance(IecRange.MinCelsius);
        _maxOhms = Resistance(IecRange.MaxCelsius);
    }

    public double R0Ohms { get; }
    public double CoefficientA { get; }
    public double CoefficientB { get; }
    public double CoefficientC { get; }

    public bool UsesIecCoefficients => CoefficientA == IecA && CoefficientB == IecB && CoefficientC == IecC;

    public string Description => 
        FormattableString.Invariant($"Platinum RTD, R0 = {EngineeringFormat.Format(R0Ohms, UnitKind.Ohm, 6)}, ") +
        (UsesIecCoefficients ? "IEC 60751 coefficients" : FormattableString.Invariant($"Callendar–Van Dusen A = {CoefficientA:G6}, B = {CoefficientB:G6}, C = {CoefficientC:G6}")) +
        $", valid {ValidRange}";

    public TemperatureRange ValidRange => IecRange;

    public double ResistanceOhms(double temperatureCelsius)
    {
        RangeGuard.CheckTemperature(temperatureCelsius, ValidRange, this);
        return Resistance(temperatureCelsius);
    }

    public double TemperatureCelsius(double resistanceOhms)
    {
        RangeGuard.CheckResistance(resistanceOhms, _minOhms, _maxOhms, ValidRange, this);
        var t = QuadraticRoot(resistanceOhms / R0Ohms);
        if (resistanceOhms >= R0Ohms) return t;
        for (var step = 0; step < 50; step++)
        {
            var dt = (Resistance(t) - resistanceOhms) / Slope(t);
            t -= dt;
            if (Math.Abs(dt) <= 1e-13) break;
        }
        return t;
    }

    public double SlopeOhmsPerKelvin(double temperatureCelsius)
    {
        RangeGuard.CheckTemperature(temperatureCelsius, ValidRange, this);
        return Slope(temperatureCelsius);
    }

    private double Resistance(double t)
    {
        var poly = 1 + t * (CoefficientA + t * CoefficientB);
        if (t < 0) poly += CoefficientC * (t - 100) * t * t * t;
        return R0Ohms * poly;
    }

    private double Slope(double t)
    {
        var poly = CoefficientA + 2 * CoefficientB * t;
        if (t < 0) poly += CoefficientC * (4 * t - 300) * t * t;
        return R0Ohms * poly;
    }

    /// <summary>Root of B t² + A t − (ρ − 1) = 0 written as 2(ρ−1)/(A + √(A² + 4B(ρ−1))) to avoid cancellation near 0 °C.</summary>
    private double QuadraticRoot(double ratio)
    {
        var excess = ratio - 1;
        var discriminant = CoefficientA * CoefficientA + 4 * CoefficientB * excess;
        return 2 * excess / (CoefficientA + Math.Sqrt(Math.Max(discriminant, 0)));
    }
}
