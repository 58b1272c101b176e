using System.Globalization;
using ThermVerify.Quantities;

namespace ThermVerify.Sensors;

/// <summary>
/// The one place that words out-of-range errors, so every model names the value, itself and its limits
/// the same way. Resistance limits are derived from the temperature range, because a user holding an ADC
/// reading thinks in ohms, not in the model's temperature span.
/// </summary>
internal static class RangeGuard
{
    // The model, not its description, is passed: formatting the description on every in-range call
    // cost about 1 µs, more than a whole circuit solve in a temperature sweep.
    // Values a rounding error past a limit (a round trip through the model at its own edge) are still inside.
    private const double EdgeSlackKelvin = 1e-9;
    private const double EdgeSlackRelative = 1e-12;

    public static void CheckTemperature(double celsius, TemperatureRange range, ISensorModel model)
    {
        if (celsius >= range.MinCelsius - EdgeSlackKelvin && celsius <= range.MaxCelsius + EdgeSlackKelvin) return;
        throw new SensorRangeException(FormattableString.Invariant(
            $"Temperature {celsius:G6} °C is outside the valid range of {model.Description} ({range}); ") +
            "no extrapolation is done: use a model whose valid range covers this temperature.");
    }

    public static void CheckResistance(double ohms, double minOhms, double maxOhms, TemperatureRange range, ISensorModel model)
    {
        if (ohms >= minOhms * (1 - EdgeSlackRelative) && ohms <= maxOhms * (1 + EdgeSlackRelative)) return;
        throw new SensorRangeException(FormattableString.Invariant(
            $"Resistance {EngineeringFormat.Format(ohms, UnitKind.Ohm, 6)} is outside the valid range of {model.Description}: {EngineeringFormat.Format(minOhms, UnitKind.Ohm, 6)} to {EngineeringFormat.Format(maxOhms, UnitKind.Ohm, 6)}, which corresponds to {range}; ") +
            "no extrapolation is done: check the reading or widen the model's valid range.");
    }

    /// <summary>Rejects a range that is empty, not finite or below absolute zero.</summary>
    public static TemperatureRange Validate(TemperatureRange range, string parameterName)
    {
        if (!double.IsFinite(range.MinCelsius) || !double.IsFinite(range.MaxCelsius)
            || range.MinCelsius >= range.MaxCelsius
            || range.MinCelsius <= -Quantities.PhysicalConstants.ZeroCelsiusInKelvin)
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                $"Valid range {range} is not usable: it needs finite limits, minimum below maximum, and a minimum above −273.15 °C."),
                parameterName);
        return range;
    }

    public static double RequirePositiveFinite(double value, string what, string parameterName)
    {
        if (double.IsFinite(value) && value > 0) return value;
        throw new ArgumentOutOfRangeException(parameterName, value,
            $"{what} must be a positive finite number; got {value.ToString("G6", CultureInfo.InvariantCulture)}.");
    }
}
