using System.Globalization;
using ThermVerify.Quantities;

namespace ThermVerify.Design;

/// <summary>
/// Reads the delta-sigma part of [adc] (kind = "delta-sigma"): the modulator and data rates, the input (unbuffered with
/// its sampling capacitance, or buffered with its input current), the gain, the digital filter, what happens on a
/// channel change, the noise table and the interference to reject. docs/design-file.md lists the keys.
/// </summary>
internal static class DeltaSigmaReader
{
    /// <summary>The keys only a delta-sigma converter has.</summary>
    public static readonly string[] OwnKeys =
    [
        "modulator_rate", "data_rate", "input", "input_current", "filter", "average_length", "filter_reset", "channel_filter",
        "readings_discarded", "noise_table", "rejection_frequencies", "interference",
    ];

    /// <summary>The keys only a successive-approximation converter has (its acquisition window and precharge).</summary>
    public static readonly string[] SuccessiveApproximationKeys = ["sample_rate", "acquisition_time", "switch_resistance", "precharge", "precharge_voltage", "charge_injection"];

    public const int MaximumOrder = 8;
    public const int MaximumAverage = 1024;
    public const int MaximumDecimation = 1 << 20;
    /// <summary>The filter is followed sample by sample at the modulator rate: its impulse response is at most this long (32 MB).</summary>
    public const int MaximumImpulseSamples = 1 << 22;
    public const int MaximumDiscarded = 1000;
    public const int MaximumRejectionFrequencies = 16;
    public const int MaximumNoiseRows = 256;

    private static readonly Dictionary<string, bool> ChannelFilters = new() { ["own"] = false, ["shared"] = true };

    private static readonly Dictionary<string, bool> Inputs = new() { ["unbuffered"] = false, ["buffered"] = true };

    private static readonly Dictionary<string, int> Filters =
        Enumerable.Range(1, MaximumOrder).ToDictionary(n => $"sinc{n}", n => n);

    public static DeltaSigmaSpec Read(TomlSection s)
    {
        var modulator = s.RequiredValue("modulator_rate", Bound.Positive, "Write modulator_rate = \"256 kHz\" (the rate the modulator samples the input at).", UnitKind.Hertz);
        var dataRate = s.RequiredValue("data_rate", Bound.Positive, "Write data_rate = \"20 Hz\" (readings per second of the selected channel).", UnitKind.Hertz);
        var order = s.Choice("filter", Filters) ?? throw s.Missing("filter", "Write filter = \"sinc3\" (sinc1 .. sinc8: the digital filter's order).");
        var average = s.Integer("average_length") ?? 1;
        if (average is < 1 or > MaximumAverage)
            throw s.ErrorAtValue("average_length", $"{average} is outside 1..{MaximumAverage}",
                "Give the number of sinc outputs the filter averages into one reading (1: a plain sinc filter).");
        var decimation = modulator / (dataRate * average);
        if (decimation < 1 || Math.Abs(decimation - Math.Round(decimation)) > 1e-6 * decimation)
            throw s.ErrorAtValue("data_rate", Invariant($"the decimation modulator_rate / (data_rate · average_length) = {decimation:G6} is not a whole number of at least 1"),
                "A delta-sigma filter decimates by a whole number of modulator samples: give the data rate and the modulator rate the converter really runs at.");
        if (decimation > MaximumDecimation)
            throw s.ErrorAtValue("data_rate", Invariant($"the decimation {decimation:G6} is more than {MaximumDecimation}"),
                "Check the modulator rate and the data rate (and their prefixes).");
        var impulse = order * (decimation - 1) + (average - 1) * decimation + 1;
        if (impulse > MaximumImpulseSamples)
            throw s.ErrorAtValue("data_rate", Invariant($"the filter's impulse response would be {impulse:G4} modulator samples long, more than {MaximumImpulseSamples}"),
                "Check the modulator rate, the data rate and the filter (a slower data rate at this modulator rate is beyond what thermverify follows sample by sample).");
        var buffered = s.Choice("input", Inputs) ?? throw s.Missing("input", "Write input = \"unbuffered\" or \"buffered\" (whether the converter's input buffer is on).");
        double capacitance = 0;
        if (buffered)
        {
            if (s.Has("sampling_capacitance"))
                throw s.ErrorAtKey("sampling_capacitance", "sampling_capacitance applies only to an unbuffered input; with the buffer on the pin sees its input current",
                    "Remove it and give input_current, or set input = \"unbuffered\".");
        }
        else
        {
            if (s.Has("input_current"))
                throw s.ErrorAtKey("input_current", "input_current applies only to a buffered input; an unbuffered input draws its current through the sampling capacitance",
                    "Remove it and give sampling_capacitance, or set input = \"buffered\".");
            capacitance = s.RequiredValue("sampling_capacitance", Bound.Positive,
                "Write sampling_capacitance = \"8 pF\" (the capacitance the unbuffered input charges every modulator period).", UnitKind.Farad);
        }
        var gain = s.Number("gain") ?? 1;
        if (!(gain > 0))
            throw s.ErrorAtValue("gain", "the gain must be greater than zero", "Write gain = 1 (or the programmable gain the firmware sets, e.g. 16).");
        var discarded = s.Integer("readings_discarded") ?? 0;
        if (discarded is < 0 or > MaximumDiscarded)
            throw s.ErrorAtValue("readings_discarded", $"{discarded} is outside 0..{MaximumDiscarded}",
                "Give the readings the firmware throws away after a channel switch, e.g. readings_discarded = 2 (0: the first is used).");
        var spec = new DeltaSigmaSpec
        {
            ModulatorRateHertz = modulator,
            DataRateHertz = dataRate,
            InputBuffered = buffered,
            SamplingCapacitanceFarads = capacitance,
            InputCurrentAmperes = buffered ? s.ValueOr("input_current", 0, Bound.Any, UnitKind.Ampere) : 0,
            InputCurrentSigned = buffered && SignWritten.Of(s, "input_current"),
            Gain = gain,
            Filter = average > 1 ? DigitalFilterKind.SincAverage : DigitalFilterKind.Sinc,
            FilterOrder = order,
            AverageLength = (int)average,
            FilterReset = s.Boolean("filter_reset") ?? true,
            SharedFilter = s.Choice("channel_filter", ChannelFilters) ?? false,
            ReadingsDiscarded = (int)discarded,
            RejectionHertz = s.QuantityList("rejection_frequencies", Bound.Positive, MaximumRejectionFrequencies, UnitKind.Hertz) ?? [50, 60],
            InterferenceVolts = s.Quantity("interference", Bound.Positive, UnitKind.Volt)?.Value,
        };
        return spec with { NoiseTable = NoiseTable(s, spec) };
    }

    /// <summary>[[adc.noise_table]]: rows of data rate, gain and rms noise; the row at the design's own rate and gain must be there.</summary>
    private static IReadOnlyList<NoiseAtRate> NoiseTable(TomlSection s, DeltaSigmaSpec spec)
    {
        var rows = s.Sections("noise_table");
        if (rows.Count == 0) return [];
        if (s.Has("noise"))
            throw s.ErrorAtKey("noise", "both noise and [[adc.noise_table]] declare the converter's noise",
                "Keep one: the table (its row at the design's data rate and gain is used) or a single noise value.");
        if (rows.Count > MaximumNoiseRows)
            throw s.ErrorAtKey("noise_table", $"the table has {rows.Count} rows, more than {MaximumNoiseRows}", "Keep the rows of the data rates and gains the design may use.");
        var table = new List<NoiseAtRate>();
        foreach (var row in rows)
        {
            row.AllowOnly(["data_rate", "gain", "noise"]);
            var rate = row.RequiredValue("data_rate", Bound.Positive, "Write data_rate = \"20 Hz\" in every row.", UnitKind.Hertz);
            var gain = row.Number("gain") ?? 1;
            if (!(gain > 0))
                throw row.ErrorAtValue("gain", "the gain must be greater than zero", "Write the row's gain, e.g. gain = 1.");
            var noise = row.RequiredValue("noise", Bound.Positive, "Write noise = \"0.3 uV\" (rms, referred to the input) in every row.", UnitKind.Volt);
            if (table.Any(r => DeltaSigmaSpec.SameRate(r.DataRateHertz, rate) && DeltaSigmaSpec.SameRate(r.Gain, gain)))
                throw row.ErrorAtValue("data_rate", Invariant($"a second row for {EngineeringFormat.Format(rate, UnitKind.Hertz)} at gain {gain:G6}"),
                    "Keep one row for each data rate and gain.");
            table.Add(new NoiseAtRate(rate, gain, noise));
        }
        if ((spec with { NoiseTable = table }).TableNoise is null)
            throw s.ErrorAtKey("noise_table", Invariant($"the noise table has no row at the design's data rate {EngineeringFormat.Format(spec.DataRateHertz, UnitKind.Hertz)} and gain {spec.Gain:G6}"),
                "Add the row for this data rate and gain (thermverify does not interpolate a converter's noise), or choose a data rate and gain the table lists.");
        return table;
    }

    private static string Invariant(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);
}
