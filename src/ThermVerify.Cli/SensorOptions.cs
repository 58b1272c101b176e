using System.CommandLine;
using System.Globalization;
using ThermVerify.Quantities;
using ThermVerify.Sensors;

namespace ThermVerify.Cli;

/// <summary>Options that name one sensor model on the command line, and the model they name.</summary>
internal sealed class SensorOptions
{
    public Option<string?> Beta { get; } = new("--beta") { Description = "NTC Beta model: β in K, e.g. 3950 (needs --r25)" };
    public Option<string?> R25 { get; } = new("--r25") { Description = "NTC resistance at 25 °C, e.g. 10k or \"10 kohm\"" };
    public Option<string?> SteinhartHart { get; } = new("--steinhart-hart") { Description = "NTC Steinhart–Hart coefficients \"A,B,C\" or \"A,B,C,D\" (D: squared term)" };
    public Option<string?> Rtd { get; } = new("--rtd") { Description = "platinum RTD per IEC 60751: R0, e.g. 1k or \"1000 ohm\"" };
    public Option<FileInfo?> RtTable { get; } = new("--rt-table") { Description = "NTC R–T table: CSV of °C and Ω" };

    public IEnumerable<Option> All => [Beta, R25, SteinhartHart, Rtd, RtTable];

    public ISensorModel Build(ParseResult parsed)
    {
        var beta = parsed.GetValue(Beta);
        var sh = parsed.GetValue(SteinhartHart);
        var rtd = parsed.GetValue(Rtd);
        var table = parsed.GetValue(RtTable);
        var given = new[] { beta is not null, sh is not null, rtd is not null, table is not null }.Count(g => g);
        if (given != 1)
            throw new UsageException("name exactly one sensor model: --beta with --r25, --steinhart-hart, --rtd or --rt-table");

        if (beta is not null)
        {
            var r25 = parsed.GetValue(R25) ?? throw new UsageException("--beta needs --r25, the resistance at 25 °C");
            return new BetaThermistor(QuantityParser.Parse(r25, UnitKind.Ohm).Value,
                QuantityParser.Parse(beta, UnitKind.Kelvin, UnitKind.Dimensionless).Value);
        }
        if (sh is not null)
        {
            var c = sh.Split(',').Select(ParseCoefficient).ToArray();
            if (c.Length is not (3 or 4)) throw new UsageException($"--steinhart-hart \"{sh}\": give 3 or 4 coefficients separated by commas");
            return new SteinhartHartThermistor(c[0], c[1], c[2], c.Length == 4 ? c[3] : 0);
        }
        if (rtd is not null) return new PlatinumRtd(QuantityParser.Parse(rtd, UnitKind.Ohm).Value);
        return TableThermistor.Load(table!.FullName);
    }

    private static double ParseCoefficient(string text) =>
        double.TryParse(text.Trim(), NumberStyles.Float, CultureInfo.InvariantCulture, out var value) && double.IsFinite(value)
            ? value
            : throw new UsageException($"\"{text.Trim()}\" is not a number; write coefficients like 1.125e-3");
}

/// <summary>The command line is inconsistent in a way the parser cannot see (exit code 2).</summary>
internal sealed class UsageException(string message) : Exception(message);
