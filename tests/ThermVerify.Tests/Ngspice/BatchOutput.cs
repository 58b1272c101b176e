using System.Diagnostics;
using System.Globalization;
using System.Text.RegularExpressions;

namespace ThermVerify.Tests.Ngspice;

/// <summary>
/// What <c>ngspice -b deck.cir</c> prints, read back: the <c>.print</c> tables (every page, by column name) and the
/// <c>.meas</c> results. This is how a user reproduces a figure by hand, so the tests read it the same way.
/// </summary>
internal sealed partial class BatchOutput
{
    private readonly Dictionary<string, List<double>> columns = new(StringComparer.OrdinalIgnoreCase);
    private readonly Dictionary<string, double> measures = new(StringComparer.OrdinalIgnoreCase);

    public static BatchOutput Run(string deck)
    {
        var file = Path.Combine(Path.GetTempPath(), $"tv-batch-{Guid.NewGuid():N}.cir");
        File.WriteAllText(file, deck);
        try
        {
            var start = new ProcessStartInfo("ngspice", ["-b", file]) { RedirectStandardOutput = true, RedirectStandardError = true };
            using var process = Process.Start(start)!;
            var error = process.StandardError.ReadToEndAsync();
            var output = process.StandardOutput.ReadToEnd();
            process.WaitForExit();
            Assert.True(process.ExitCode == 0, $"ngspice -b exited {process.ExitCode}: {error.Result}");
            return Parse(output);
        }
        finally
        {
            File.Delete(file);
        }
    }

    public IReadOnlyList<double> Column(string name) =>
        columns.TryGetValue(name, out var values) ? values : throw new KeyNotFoundException($"ngspice printed no column '{name}'; columns: {string.Join(", ", columns.Keys)}");

    public double Measure(string name) =>
        measures.TryGetValue(name, out var value) ? value : throw new KeyNotFoundException($"ngspice printed no measurement '{name}'");

    public static BatchOutput Parse(string text)
    {
        var result = new BatchOutput();
        string[]? header = null;
        foreach (var raw in text.Split('\n'))
        {
            var line = raw.Trim();
            if (line.StartsWith("Index", StringComparison.Ordinal))
            {
                header = line.Split((char[]?)null, StringSplitOptions.RemoveEmptyEntries);
                continue;
            }
            var cells = line.Split((char[]?)null, StringSplitOptions.RemoveEmptyEntries);
            if (header is not null && cells.Length == header.Length && int.TryParse(cells[0], out var index))
            {
                for (var c = 1; c < cells.Length; c++)
                {
                    var column = result.columns.TryGetValue(header[c], out var list) ? list : result.columns[header[c]] = [];
                    if (column.Count == index) column.Add(double.Parse(cells[c], CultureInfo.InvariantCulture));
                }
                continue;
            }
            if (Measurement().Match(line) is { Success: true } m)
                result.measures[m.Groups[1].Value] = double.Parse(m.Groups[2].Value, CultureInfo.InvariantCulture);
        }
        return result;
    }

    [GeneratedRegex(@"^(\w+)\s*=\s*([-+0-9.eE]+)$")]
    private static partial Regex Measurement();
}
