namespace ThermVerify.Design;

/// <summary>
/// 3 or 4 wires to a voltage-excited sensor: a bridge takes 3 (the leads in its arms, the third in the sense line), a
/// divider takes 2 only; 4 wires need a current source. The two matched currents' mismatch belongs to a current source.
/// </summary>
internal static class BridgeWiringRules
{
    public static void Check(TomlSection root, FrontEndDesign design)
    {
        var wiring = root.Section("wiring")!;
        if (design.Bridge is null)
            throw wiring.ErrorAtValue("wires", "a divider's sensor is wired with 2 wires",
                "Write wires = 2 (both leads in the sensor's arm of the divider), wire 3 in a [bridge] (a lead in each arm), or excite the sensor with a [current_source] for 3 or 4 wires.");
        if (design.Wiring!.Wires != 3)
            throw wiring.ErrorAtValue("wires", "a bridge's sensor is wired with 2 or 3 wires",
                "Write wires = 3 (a lead in the sensor's arm, one in the adjacent arm, the third in the sense line), or excite the sensor with a [current_source] for 4 wires.");
        if (design.Wiring.CurrentMismatch != 0)
            throw wiring.ErrorAtKey("current_mismatch", "a bridge has no second current: its 3 wires put a lead in each arm",
                "Remove current_mismatch; the mismatch of the two arms' leads is lead_mismatch.");
    }
}
