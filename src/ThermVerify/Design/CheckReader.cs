using ThermVerify.Quantities;
using ThermVerify.Sensors;

namespace ThermVerify.Design;

/// <summary>Reads [check] and its [[check.region]] entries.</summary>
internal static class CheckReader
{
    public static CheckSpec Read(TomlSection s, TemperatureRange sensorRange)
    {
        s.AllowOnly(["range", "step", "budget", "settle_limit", "board_temperature", "region"]);
        var range = Range(s, "range") ?? throw s.Missing("range", "Write range = \"-40 degC .. 125 degC\".");
        if (range.MinCelsius < sensorRange.MinCelsius || range.MaxCelsius > sensorRange.MaxCelsius)
            throw s.ErrorAtValue("range", $"{range} reaches outside the sensor's valid range {sensorRange}",
                "Narrow the check range, or widen [sensor] valid_range where the model allows it.");
        var step = s.ValueOr("step", DesignDefaults.StepKelvin, Bound.Positive, UnitKind.Kelvin);
        if (step > range.MaxCelsius - range.MinCelsius)
            throw s.ErrorAtValue("step", "the step is wider than the range", "Use a step of a fraction of the range, e.g. \"1 K\".");
        var regions = s.Sections("region").Select(r => ReadRegion(r, range)).ToList();
        return new CheckSpec
        {
            Range = range,
            StepKelvin = step,
            BudgetKelvin = s.RequiredValue("budget", Bound.Positive, "Write budget = \"0.5 K\" (allowed total error).", UnitKind.Kelvin),
            SettleLimitLsb = s.ValueOr("settle_limit", DesignDefaults.SettleLimitLsb, Bound.Positive, UnitKind.Lsb),
            BoardCelsius = s.Quantity("board_temperature", Bound.Any, UnitKind.Celsius)?.Value,
            Regions = regions,
        };
    }

    private static CheckRegion ReadRegion(TomlSection r, TemperatureRange outer)
    {
        r.AllowOnly(["range", "budget"]);
        var range = Range(r, "range") ?? throw r.Missing("range", "Write range = \"0 degC .. 50 degC\" for this region.");
        if (range.MinCelsius < outer.MinCelsius || range.MaxCelsius > outer.MaxCelsius)
            throw r.ErrorAtValue("range", $"{range} reaches outside the check range {outer}", "Keep each region inside [check] range.");
        return new CheckRegion(range, r.RequiredValue("budget", Bound.Positive, "Write budget = \"0.2 K\" for this region.", UnitKind.Kelvin));
    }

    private static TemperatureRange? Range(TomlSection s, string key) =>
        s.Range(key, UnitKind.Celsius) is { } q ? new TemperatureRange(q.Min, q.Max) : null;
}
