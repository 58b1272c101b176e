using System.Globalization;
using System.Numerics;

namespace ThermVerify.Ngspice;

/// <summary>
/// Reads ngspice's ASCII raw file (several plots, each: header, Variables:, Values:). Nothing in it is taken on
/// trust: a header that is missing or out of range, a count the file does not hold, a value that is not a number,
/// or a file that ends early is a clear <see cref="NgspiceException"/> naming the line, never a crash.
/// </summary>
internal static class AsciiRawReader
{
    private const int MaximumVariables = 100_000;

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
        if (plots.Count == 0)
            throw Damaged(lines.Length, "it holds no plot (no \"Title:\" line)");
        return plots;
    }

    private static NgspicePlot ReadPlot(string[] lines, ref int i, int index)
    {
        string title = Value(lines[i]), plotName = "", flags = "real";
        int? variableCount = null, pointCount = null;
        for (i++; i < lines.Length && !lines[i].StartsWith("Variables:", StringComparison.Ordinal); i++)
        {
            var line = lines[i];
            if (line.StartsWith("Plotname:", StringComparison.Ordinal)) plotName = Value(line);
            else if (line.StartsWith("Flags:", StringComparison.Ordinal)) flags = Value(line);
            else if (line.StartsWith("No. Variables:", StringComparison.Ordinal)) variableCount = Count(line, i, MaximumVariables);
            else if (line.StartsWith("No. Points:", StringComparison.Ordinal)) pointCount = Count(line, i, int.MaxValue);
            else if (line.StartsWith("Title:", StringComparison.Ordinal)) break;
        }
        if (i >= lines.Length || !lines[i].StartsWith("Variables:", StringComparison.Ordinal))
            throw Damaged(i, "a plot has no \"Variables:\" section");
        if (variableCount is not { } variables || pointCount is not { } points)
            throw Damaged(i, "a plot does not say how many variables and points it has");
        // Every value takes a line: a header that promises more than the file holds is a truncated file, found before any allocation.
        if ((long)variables * points > lines.Length - i)
            throw Damaged(i, $"the file ends before the {points} points of {variables} variables it announces (truncated)");

        var names = new string[variables];
        for (var v = 0; v < variables; v++)
        {
            var fields = Line(lines, ++i).Split('\t', StringSplitOptions.RemoveEmptyEntries);
            if (fields.Length < 2)
                throw Damaged(i, "a variable line has no name");
            names[v] = fields[1];
        }
        i++;
        while (i < lines.Length && !lines[i].StartsWith("Values:", StringComparison.Ordinal)) i++;
        if (i >= lines.Length)
            throw Damaged(i, "a plot has no \"Values:\" section");
        i++;

        var isComplex = flags.Contains("complex", StringComparison.Ordinal);
        var data = new Complex[variables][];
        for (var v = 0; v < variables; v++) data[v] = new Complex[points];
        for (var p = 0; p < points; p++)
            for (var v = 0; v < variables; v++)
            {
                var fields = Line(lines, i).Split('\t', StringSplitOptions.RemoveEmptyEntries);
                if (fields.Length == 0)
                    throw Damaged(i, "a value is missing");
                data[v][p] = ParseValue(fields[^1], isComplex, i);
                i++;
            }

        var vectors = new Dictionary<string, NgspiceVector>();
        for (var v = 0; v < variables; v++)
            vectors[SharedLibraryName(names[v])] = new NgspiceVector(names[v], data[v].Select(c => c.Real).ToArray(), isComplex ? data[v] : null);
        return new NgspicePlot(ShortName(plotName, index), title, vectors);
    }

    private static string Line(string[] lines, int i) =>
        i < lines.Length ? lines[i] : throw Damaged(i, "the file ends early (truncated)");

    private static int Count(string line, int i, int maximum) =>
        int.TryParse(Value(line), NumberStyles.None, CultureInfo.InvariantCulture, out var n) && n >= 0 && n <= maximum
            ? n
            : throw Damaged(i, $"\"{line.Trim()}\" is not a count");

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

    private static Complex ParseValue(string field, bool isComplex, int line)
    {
        if (!isComplex) return new Complex(Number(field, line), 0);
        var parts = field.Split(',');
        if (parts.Length != 2) throw Damaged(line, $"\"{field}\" is not a complex value");
        return new Complex(Number(parts[0], line), Number(parts[1], line));
    }

    private static double Number(string text, int line) =>
        double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out var value)
            ? value
            : throw Damaged(line, $"\"{(text.Length > 40 ? text[..40] + "…" : text)}\" is not a number");

    private static NgspiceException Damaged(int zeroBasedLine, string problem) =>
        new($"ngspice's result file is damaged at line {zeroBasedLine + 1}: {problem}; the deck's results cannot be read", []);

    private static string Value(string line) => line[(line.IndexOf(':') + 1)..].Trim();
}
