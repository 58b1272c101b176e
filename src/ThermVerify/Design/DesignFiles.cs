namespace ThermVerify.Design;

/// <summary>The files a design is made of: the design file and every file it names (an R–T table, an op-amp subcircuit).</summary>
internal static class DesignFiles
{
    public static IReadOnlyList<string> Of(string designPath, FrontEndDesign? design)
    {
        var files = new List<string> { Path.GetFullPath(designPath) };
        if (design?.Sensor is TableSensorSpec table) files.Add(table.FullPath);
        if (design?.Buffer?.Subcircuit is { } sub) files.Add(sub.FullPath);
        if (design?.Netlist is { } netlist) files.Add(netlist.FullPath);
        return files;
    }
}
