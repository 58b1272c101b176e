using ThermVerify.Quantities;

namespace ThermVerify.Design;

/// <summary>Reads [protection].</summary>
internal static class ProtectionReader
{
    public static ProtectionSpec Read(TomlSection s)
    {
        s.AllowOnly(["clamp_leakage", "clamp_leakage_temperature", "clamp_leakage_doubling", "clamp_rail", "clamp_temperature",
            "insulation_resistance", "insulation_to"]);
        var leakage = s.ValueOr("clamp_leakage", 0, Bound.Any, UnitKind.Ampere);
        // Written as 0 (no clamps, or a remedy that removes them) the other clamp keys may stay; left out, they say nothing.
        if (!s.Has("clamp_leakage"))
            foreach (var key in new[] { "clamp_leakage_temperature", "clamp_leakage_doubling", "clamp_rail", "clamp_temperature" })
                if (s.Has(key))
                    throw s.ErrorAtKey(key, $"{key} without clamp diodes", "Give each diode's reverse leakage, e.g. clamp_leakage = \"5 nA\", or remove the key.");
        if (!s.Has("insulation_resistance") && s.Has("insulation_to"))
            throw s.ErrorAtKey("insulation_to", "insulation_to without insulation_resistance",
                "Give the lowest insulation resistance, e.g. insulation_resistance = \"100 Mohm\", or remove insulation_to.");
        return new ProtectionSpec
        {
            ClampLeakageAmperes = leakage,
            ClampLeakageSigned = SignWritten.Of(s, "clamp_leakage"),
            ClampLeakageCelsius = s.ValueOr("clamp_leakage_temperature", DesignDefaults.PinLeakageCelsius, Bound.Any, UnitKind.Celsius),
            ClampDoublingKelvin = s.ValueOr("clamp_leakage_doubling", DesignDefaults.LeakageDoublingKelvin, Bound.Positive, UnitKind.Kelvin),
            ClampRailVolts = s.Quantity("clamp_rail", Bound.Positive, UnitKind.Volt)?.Value,
            ClampCelsius = s.Quantity("clamp_temperature", Bound.Any, UnitKind.Celsius)?.Value,
            InsulationOhms = s.Quantity("insulation_resistance", Bound.Positive, UnitKind.Ohm)?.Value,
            InsulationToVolts = s.ValueOr("insulation_to", 0, Bound.Any, UnitKind.Volt),
        };
    }
}
