using ThermVerify.Quantities;

namespace ThermVerify.Design;

/// <summary>[netlist] and its [[netlist.part]] entries, written back as the loader reads them.</summary>
internal static partial class DesignWriter
{
    private static void WriteNetlist(Writer w, NetlistSpec n)
    {
        w.Section("netlist");
        w.Text("file", n.File);
        w.Names("sensor", n.SensorElements);
        w.Text("pin", n.PinNode);
        if (n.NegativePinNode is { } negative)
            w.Text("negative_pin", negative);
        if (n.ReferenceNode is { } reference)
            w.Text("reference", reference);
        if (n.Excitation.Count > 0)
            w.Names("excitation", n.Excitation);
        if (n.FixedElement is { } fixedElement)
            w.Text("fixed", fixedElement);
        if (n.SwitchOnLeadSeconds is { } lead)
            w.Value("switch_on_lead", lead, UnitKind.Second);
        if (n.ReadingIntervalSeconds is { } interval)
            w.Value("reading_interval", interval, UnitKind.Second);
        foreach (var part in n.Parts)
        {
            w.Entry("netlist.part");
            w.Text("name", part.Name);
            w.Value("tolerance", part.Tolerance, UnitKind.Percent);
            if (part.TempcoPerKelvin != 0 || part.TempcoSigned)
                w.Value("tempco", part.TempcoPerKelvin, UnitKind.PpmPerKelvin, part.TempcoSigned);
        }
    }
}
