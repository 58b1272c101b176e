using System.Globalization;
using System.Numerics;

namespace ThermVerify.Ngspice;

/// <summary>Reads ngspice's ASCII raw file (several plots, each: header, Variables:, Values:).</summary>
internal static class AsciiRawReader
{
    public static List<NgspicePlot> Read(string text)
    {
        var lines = text.Replace("\r\n", "\n").Split('\n');
        var plots = new List<NgspicePlot>();
        var i = 0;
        while (i < lines.Length)
        {
            if (!lines[i].StartsWith("Title:", StringComparison.Ordinal)) { i++; continue; }
            plots.Add(ReadPlot(lines, ref i, plots.Count));
        }
        return plots;
    }

    private static NgspicePlot ReadPlot(string[] lines, ref int i, int index)
    {
        string title = Value(lines[i]), plotName = "", flags = "real";
        int variableCount = 0, pointCount = 0;
        for (i++; i < lines.Length && !lines[i].StartsWith("Variables:", StringComparison.Ordinal); i++)
        {
            var line = lines[i];
            if (line.StartsWith("Plotname:", StringComparison.Ordinal)) plotName = Value(line);
            else if (line.StartsWith("Flags:", StringComparison.Ordinal)) flags = Value(line);
            else if (line.StartsWith("No. Variables:", StringComparison.Ordinal)) variableCount = int.Parse(Value(line), CultureInfo.InvariantCulture);
            else if (line.StartsWith("No. Points:", StringComparison.Ordinal)) pointCount = int.Parse(Value(line), CultureInfo.InvariantCulture);
        }
        var names = new string[variableCount];
        for (var v = 0; v < variableCount; v++) names[v] = lines[++i].Split('\t', StringSplitOptions.RemoveEmptyEntries)[1];
        while (!lines[i].StartsWith("Values:", StringComparison.Ordinal)) i++;
        i++;

        var isComplex = flags.Contains("complex", StringComparison.Ordinal);
        var data = new Complex[variableCount][];
        for (var v = 0; v < variableCount; v++) data[v] = new Complex[pointCount];
        for (var p = 0; p < pointCount; p++)
            for (var v = 0; v < variableCount; v++)
            {
                var fields = lines[i++].Split('\t', StringSplitOptions.RemoveEmptyEntries);
                data[v][p] = ParseValue(fields[^1], isComplex);
            }

        var vectors = new Dictionary<string, NgspiceVector>();
        for (var v = 0; v < variableCount; v++)
            vectors[SharedLibraryName(names[v])] = new NgspiceVector(names[v], data[v].Select(c => c.Real).ToArray(), isComplex ? data[v] : null);
        return new NgspicePlot(ShortName(plotName, index), title, vectors);
    }

    // The raw file carries descriptive plot names ("DC transfer characteristic"); map them to the short type names
    // the shared library uses, so both runners answer Plot("dc"), Plot("tran"), Plot("ac"), Plot("noise").
    private static string ShortName(string plotName, int index) => plotName switch
    {
        _ when plotName.StartsWith("DC transfer", StringComparison.OrdinalIgnoreCase) => $"dc{index + 1}",
        _ when plotName.StartsWith("Transient", StringComparison.OrdinalIgnoreCase) => $"tran{index + 1}",
        _ when plotName.StartsWith("AC", StringComparison.OrdinalIgnoreCase) => $"ac{index + 1}",
        _ when plotName.StartsWith("Noise", StringComparison.OrdinalIgnoreCase) => $"noise{index + 1}",
        _ when plotName.StartsWith("Operating", StringComparison.OrdinalIgnoreCase) => $"op{index + 1}",
        _ => plotName,
    };

    // The raw file writes v(out) and i(v1); the shared library calls the same vectors out and v1#branch.
    private static string SharedLibraryName(string rawName)
    {
        var name = rawName.ToLowerInvariant();
        if (name.StartsWith("v(", StringComparison.Ordinal) && name.EndsWith(')') && !name.Contains(',')) return name[2..^1];
        if (name.StartsWith("i(", StringComparison.Ordinal) && name.EndsWith(')')) return name[2..^1] + "#branch";
        return name;
    }

    private static Complex ParseValue(string field, bool isComplex)
    {
        if (!isComplex) return new Complex(double.Parse(field, CultureInfo.InvariantCulture), 0);
        var parts = field.Split(',');
        return new Complex(double.Parse(parts[0], CultureInfo.InvariantCulture), double.Parse(parts[1], CultureInfo.InvariantCulture));
    }

    private static string Value(string line) => line[(line.IndexOf(':') + 1)..].Trim();
}
