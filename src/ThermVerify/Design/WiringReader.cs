using ThermVerify.Quantities;

namespace ThermVerify.Design;

/// <summary>Reads [wiring].</summary>
internal static class WiringReader
{
    public static WiringSpec Read(TomlSection s)
    {
        s.AllowOnly(["wires", "lead_resistance", "lead_tempco", "lead_temperature", "current_mismatch", "lead_mismatch"]);
        var wires = s.Integer("wires") ?? throw s.Missing("wires", "Write wires = 2, 3 or 4 (how many wires run to the sensor).");
        if (wires is < 2 or > 4)
            throw s.ErrorAtValue("wires", $"{wires} wires", "A sensor is wired with 2, 3 or 4 wires.");
        if (wires != 3 && s.Has("current_mismatch"))
            throw s.ErrorAtKey("current_mismatch", "current_mismatch applies to 3 wires only (the two matched currents)", "Remove it, or write wires = 3.");
        var mismatch = s.ValueOr("current_mismatch", 0, Bound.Any, UnitKind.Percent, UnitKind.Ppm);
        if (Math.Abs(mismatch) >= 1)
            throw s.ErrorAtValue("current_mismatch", "a mismatch of 100 % or more", "Write the mismatch between the two currents, e.g. \"0.1 %\".");
        if (wires != 3 && s.Has("lead_mismatch"))
            throw s.ErrorAtKey("lead_mismatch", "lead_mismatch applies to 3 wires in a bridge only (the leads in the bridge's arms)", "Remove it, or write wires = 3.");
        var leadMismatch = s.ValueOr("lead_mismatch", 0, Bound.Any, UnitKind.Percent, UnitKind.Ppm);
        if (Math.Abs(leadMismatch) >= 1)
            throw s.ErrorAtValue("lead_mismatch", "a mismatch of 100 % or more", "Write how far the sensor arm's lead differs from the adjacent arm's, e.g. \"2 %\".");
        return new WiringSpec
        {
            Wires = (int)wires,
            LeadOhms = s.RequiredValue("lead_resistance", Bound.NonNegative, "Write lead_resistance = \"0.5 ohm\" (each wire, at 25 degC).", UnitKind.Ohm),
            LeadTempcoPerKelvin = s.ValueOr("lead_tempco", DesignDefaults.CopperTempcoPerKelvin, Bound.Any, UnitKind.PpmPerKelvin),
            LeadCelsius = s.Quantity("lead_temperature", Bound.Any, UnitKind.Celsius)?.Value,
            CurrentMismatch = mismatch,
            CurrentMismatchSigned = SignWritten.Of(s, "current_mismatch"),
            LeadMismatch = leadMismatch,
            LeadMismatchSigned = SignWritten.Of(s, "lead_mismatch"),
        };
    }
}
