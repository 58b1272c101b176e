using ThermVerify.Circuits;
using ThermVerify.Design;
using static ThermVerify.FrontEnd.FrontEndNodes;

namespace ThermVerify.FrontEnd;

/// <summary>
/// A 3-wire sensor in a bridge with the leads in the bridge's arms (the usual compensation, common practice): the
/// sensor's arm runs from its rail through lead 1 to the sensor, the adjacent arm from the sensor's other terminal
/// through lead 2 to the fixed resistor, and lead 3 carries V+ from that terminal to the converter (only its input
/// current flows there). The sensor half then reads V+ = E·(R_s + R_L1)/(R_s + R_L1 + R_f + R_L2) with the sensor low
/// (the divider formula with a lead in each arm), so the leads cancel to first order where R_f = R_s:
/// ∂V+/∂R_L1 = E·(R_f + R_L2)/S² and ∂V+/∂R_L2 = −E·(R_s + R_L1)/S² (S the half's total). What is left is the lead
/// term E·R_L·(R_f − R_s)/S² and the mismatch term E·m·R_L·R_f/S² for R_L1 = R_L·(1 + m), R_L2 = R_L.
/// </summary>
internal static class BridgeArmLeads
{
    /// <summary>
    /// The sensor half with its leads: sensor, the sensor arm's lead, the adjacent arm's lead, the fixed resistor and
    /// the sense lead to V+ (<see cref="Divider"/>); the bridge's opposite half is added by the caller.
    /// </summary>
    public static void Add(List<Element> elements, FrontEndDesign design, WiringSpec wiring, double? boardCelsius)
    {
        var half = design.VoltageDivider;
        var mismatched = wiring with { LeadOhms = wiring.LeadOhms * (1 + wiring.LeadMismatch) };
        elements.Add(new SensorResistor(SensorElement, SensorTop, SensorBottom, design.Sensor.Build()));
        if (half.SensorSide == SensorSide.Low)
        {
            // Excitation — R_f — lead 2 — sensor top (V+ by lead 3) — sensor — lead 1 — ground.
            elements.Add(FrontEndCircuit.FixedResistor(FixedElement, Excitation, AdjacentLead, half.FixedResistorOhms, half.FixedTempcoPerKelvin, boardCelsius));
            elements.Add(FrontEndCircuit.LeadResistor(wiring, "Rlead2", AdjacentLead, SensorTop, boardCelsius));
            elements.Add(FrontEndCircuit.LeadResistor(mismatched, "Rlead1", SensorBottom, Circuit.Ground, boardCelsius));
            elements.Add(FrontEndCircuit.LeadResistor(wiring, "Rlead3", SensorTop, Divider, boardCelsius));
        }
        else
        {
            // Excitation — lead 1 — sensor — sensor bottom (V+ by lead 3) — lead 2 — R_f — ground.
            elements.Add(FrontEndCircuit.LeadResistor(mismatched, "Rlead1", Excitation, SensorTop, boardCelsius));
            elements.Add(FrontEndCircuit.LeadResistor(wiring, "Rlead2", SensorBottom, AdjacentLead, boardCelsius));
            elements.Add(FrontEndCircuit.FixedResistor(FixedElement, AdjacentLead, Circuit.Ground, half.FixedResistorOhms, half.FixedTempcoPerKelvin, boardCelsius));
            elements.Add(FrontEndCircuit.LeadResistor(wiring, "Rlead3", SensorBottom, Divider, boardCelsius));
        }
    }

    /// <summary>V+ of the sensor's half with a lead in each arm: the divider formula with R_s + R_L·(1 + m) and R_f + R_L.</summary>
    public static double PositiveVolts(SensorSide side, double excitationVolts, double sensorOhms, double fixedOhms, double leadOhms, double mismatch) =>
        DividerFormula.OutputVolts(side, excitationVolts, sensorOhms + leadOhms * (1 + mismatch), fixedOhms + leadOhms);

    /// <summary>
    /// The first-order mismatch term alone, ±E·m·R_L·R_f/(R_s + R_f)² (+ with the sensor low: a longer sensor-arm lead
    /// reads high), the whole error where R_f = R_s.
    /// </summary>
    public static double MismatchTermVolts(SensorSide side, double excitationVolts, double sensorOhms, double fixedOhms, double leadOhms, double mismatch) =>
        (side == SensorSide.Low ? 1 : -1) * excitationVolts * mismatch * leadOhms * fixedOhms / Math.Pow(sensorOhms + fixedOhms, 2);
}
