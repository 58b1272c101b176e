using System.CommandLine;
using System.Globalization;
using System.Text.RegularExpressions;
using ThermVerify.Design;
using ThermVerify.Files;
using ThermVerify.Firmware;
using ThermVerify.Quantities;

namespace ThermVerify.Cli;

/// <summary>`thermverify table`: the code-to-temperature table a design needs, as a C header and CSV, with its error.</summary>
internal static partial class TableCommand
{
    public static Command Create()
    {
        var design = new Argument<FileInfo>("design") { Description = "the design file (TOML)" };
        var header = new Option<FileInfo?>("--header") { Description = "write a C99 header with the table, the interpolation routine and fault thresholds" };
        var csv = new Option<FileInfo?>("--csv") { Description = "write the table as CSV (code, temperature in °C)" };
        var bound = new Option<string?>("--bound") { Description = "place breakpoints so that interpolation stays within this error, e.g. \"0.05 K\"" };
        var breakpoints = new Option<int?>("--breakpoints") { Description = "use at most this many breakpoints, placed to minimise the worst error" };
        var unit = new Option<string>("--unit") { Description = "fixed-point unit of the table: 0.1K, 0.01K or 0.001K", DefaultValueFactory = _ => "0.01K" };
        unit.AcceptOnlyFromAmong("1K", "0.1K", "0.01K", "0.001K");
        var corrected = new Option<bool>("--corrected") { Description = "correct the table for the simulated DC loading of the pin" };
        var prefix = new Option<string?>("--prefix") { Description = "C identifier prefix (default: from the design name)" };
        var force = new Option<bool>("--force") { Description = "replace output files that exist" };
        var command = new Command("table", "Generate the ADC-code-to-temperature table for firmware, with its error at every code.")
        {
            design, header, csv, bound, breakpoints, unit, corrected, prefix, force,
        };
        command.SetAction(parsed =>
        {
            var loaded = DesignLoader.Load(parsed.GetValue(design)!.FullName);
            var model = FirmwareFromDesign.Model(loaded, parsed.GetValue(corrected));
            var scale = new FixedPointScale((int)Math.Round(1 / double.Parse(parsed.GetValue(unit)!.TrimEnd('K'), CultureInfo.InvariantCulture)));
            var table = parsed.GetValue(breakpoints) is { } n ? TableBuilder.WithBreakpoints(model, scale, n)
                : parsed.GetValue(bound) is { } b ? TableBuilder.WithinBound(model, scale, QuantityParser.Parse(b, UnitKind.Kelvin).Value)
                : TableBuilder.EveryCode(model, scale);
            var error = TableErrorAnalysis.Evaluate(model, table);
            var faults = FaultAnalysis.Thresholds(model, FirmwareFromDesign.Tolerances(loaded));
            var overwrite = parsed.GetValue(force);

            if (parsed.GetValue(header) is { } h)
            {
                var coefficients = loaded.Sensor is RtdSensorSpec ? null : ComputedCoefficients.Fit(model);
                var content = new FirmwareHeaderContent(loaded.Name, parsed.GetValue(prefix) ?? PrefixFor(loaded.Name), model, table, error, faults, coefficients);
                AtomicFile.WriteAllText(h.FullName, CHeaderRenderer.Render(content.Validated()), overwrite);
            }
            if (parsed.GetValue(csv) is { } c)
                AtomicFile.WriteAllText(c.FullName, TableCsvRenderer.Render(table, breakpointsOnly: !table.IsDense), overwrite);

            var output = parsed.InvocationConfiguration.Output;
            output.WriteLine($"table for {loaded.Name}: codes {table.Span.FirstCode}..{table.Span.LastCode}, {table.Codes.Count} " +
                             $"{(table.IsDense ? "entries (every code)" : "breakpoints")}, unit {scale.Name}" +
                             (parsed.GetValue(corrected) ? ", corrected for the simulated DC loading" : ""));
            var worstCode = Math.Abs(error.MaxErrorKelvin) >= Math.Abs(error.MinErrorKelvin) ? error.MaxErrorCode : error.MinErrorCode;
            output.WriteLine(FormattableString.Invariant(
                $"table error against the true temperature: {error.MinErrorKelvin:+0.0000;-0.0000} K to {error.MaxErrorKelvin:+0.0000;-0.0000} K (worst at code {worstCode}); the converter's own ½ LSB is up to {error.HalfCodeKelvin:0.0000} K"));
            output.WriteLine($"fault thresholds: code < {faults.FaultBelowCode} or code > {faults.FaultAboveCode} is a fault (valid codes {faults.LowestValidCode}..{faults.HighestValidCode})");
            return ExitCodes.Success;
        });
        return command;
    }

    internal static string PrefixFor(string designName)
    {
        var words = NonIdentifier().Replace(designName.ToLowerInvariant(), "_").Trim('_');
        var prefix = words.Length == 0 || !char.IsAsciiLetterLower(words[0]) ? "tv_" + words : words;
        return prefix.Length > 31 ? prefix[..31].TrimEnd('_') : prefix;
    }

    [GeneratedRegex("[^a-z0-9]+")]
    private static partial Regex NonIdentifier();
}
