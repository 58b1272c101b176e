using ThermVerify.Design.Subcircuits;
using ThermVerify.Quantities;

namespace ThermVerify.Design;

/// <summary>Reads [divider], [buffer] and [filter].</summary>
internal static class CircuitReaders
{
    internal static readonly Dictionary<string, SensorSide> Sides = new() { ["high"] = SensorSide.High, ["low"] = SensorSide.Low };

    private static readonly Dictionary<string, BufferTopology> Topologies = new()
    {
        ["follower"] = BufferTopology.Follower, ["non-inverting"] = BufferTopology.NonInverting,
    };

    public static DividerSpec ReadDivider(TomlSection s)
    {
        s.AllowOnly(["sensor_side", "fixed_resistor", "fixed_tolerance", "fixed_tempco", "excitation", "excitation_tolerance", "switch_on_lead", "reading_interval"]);
        var lead = s.Quantity("switch_on_lead", Bound.Positive, UnitKind.Second)?.Value;
        var interval = s.Quantity("reading_interval", Bound.Positive, UnitKind.Second)?.Value;
        if (interval is not null && lead is null)
            throw s.ErrorAtKey("reading_interval", "reading_interval without switch_on_lead",
                "reading_interval describes a switched excitation: add switch_on_lead = \"200 us\", or remove reading_interval.");
        if (lead is { } l && interval is { } i && i <= l)
            throw s.ErrorAtValue("reading_interval", "the reading interval is not longer than the switch-on lead",
                "The excitation is on for switch_on_lead plus one conversion in every reading_interval; make the interval longer.");
        return new DividerSpec
        {
            SensorSide = s.Choice("sensor_side", Sides)
                ?? throw s.Missing("sensor_side", "Write sensor_side = \"low\" (sensor from the ADC node to ground) or \"high\" (sensor from excitation to the node)."),
            FixedResistorOhms = s.RequiredValue("fixed_resistor", Bound.Positive, "Write fixed_resistor = \"10 kohm\".", UnitKind.Ohm),
            FixedTolerance = SensorReader.Tolerance(s, "fixed_tolerance"),
            FixedTempcoPerKelvin = s.ValueOr("fixed_tempco", DesignDefaults.Tolerance, Bound.Any, UnitKind.PpmPerKelvin),
            FixedTempcoSigned = SignWritten.Of(s, "fixed_tempco"),
            ExcitationVolts = s.RequiredValue("excitation", Bound.Positive, "Write excitation = \"3.3 V\".", UnitKind.Volt),
            ExcitationTolerance = SensorReader.Tolerance(s, "excitation_tolerance"),
            SwitchOnLeadSeconds = lead,
            ReadingIntervalSeconds = interval,
        };
    }

    public static FilterSpec ReadFilter(TomlSection s)
    {
        s.AllowOnly(["series_resistor", "reservoir_capacitor"]);
        return new FilterSpec
        {
            SeriesResistorOhms = s.ValueOr("series_resistor", 0, Bound.NonNegative, UnitKind.Ohm),
            ReservoirCapacitorFarads = s.ValueOr("reservoir_capacitor", 0, Bound.NonNegative, UnitKind.Farad),
        };
    }

    private static readonly string[] BufferKeys =
    [
        "topology", "gain", "gain_bandwidth", "dc_gain", "output_resistance", "offset_voltage", "offset_drift",
        "bias_current", "offset_current", "supply", "output_swing", "input_common_mode", "slew_rate", "noise_voltage",
        "noise_current", "noise_corner", "isolation_resistor", "minimum_phase_margin", "subckt_file", "subckt_name",
    ];

    public static BufferSpec ReadBuffer(TomlSection s)
    {
        s.AllowOnly(BufferKeys);
        var topology = s.Choice("topology", Topologies) ?? BufferTopology.Follower;
        var gain = s.Number("gain");
        if (topology == BufferTopology.Follower && gain is { } g && g != 1)
            throw s.ErrorAtValue("gain", "a follower has a gain of 1", "Remove gain, or set topology = \"non-inverting\".");
        if (topology == BufferTopology.NonInverting && gain is null)
            throw s.Missing("gain", "A non-inverting stage needs its closed-loop gain, e.g. gain = 2.");
        if (gain is < 1)
            throw s.ErrorAtValue("gain", "a non-inverting gain is at least 1", "Write gain = 1 or more.");
        var supply = VoltageRange(s, "supply") ?? throw s.Missing("supply", "Write supply = \"0 V .. 3.3 V\" (the op-amp's rails).");
        var swing = s.ValueOr("output_swing", 0, Bound.NonNegative, UnitKind.Volt);
        if (2 * swing >= supply.MaxVolts - supply.MinVolts)
            throw s.ErrorAtValue("output_swing", "the headroom to both rails leaves no output range", "output_swing is the headroom to each rail, e.g. \"50 mV\".");
        var phaseMargin = s.ValueOr("minimum_phase_margin", DesignDefaults.MinimumPhaseMarginDegrees, Bound.Positive, UnitKind.Degree);
        if (phaseMargin >= 180)
            throw s.ErrorAtValue("minimum_phase_margin", "a phase margin must be below 180 degrees", "Typical limits are 45 deg to 60 deg.");
        return new BufferSpec
        {
            Topology = topology,
            Gain = gain ?? 1,
            GainBandwidthHertz = s.RequiredValue("gain_bandwidth", Bound.Positive, "Write gain_bandwidth = \"1 MHz\".", UnitKind.Hertz),
            DcGainDecibels = s.Quantity("dc_gain", Bound.Positive, UnitKind.Decibel)?.Value,
            OutputResistanceOhms = s.ValueOr("output_resistance", 0, Bound.NonNegative, UnitKind.Ohm),
            OffsetVolts = s.ValueOr("offset_voltage", 0, Bound.Any, UnitKind.Volt),
            OffsetDriftVoltsPerKelvin = s.ValueOr("offset_drift", 0, Bound.Any, UnitKind.VoltPerKelvin),
            BiasCurrentAmperes = s.ValueOr("bias_current", 0, Bound.Any, UnitKind.Ampere),
            OffsetSigned = SignWritten.Of(s, "offset_voltage"),
            OffsetDriftSigned = SignWritten.Of(s, "offset_drift"),
            BiasCurrentSigned = SignWritten.Of(s, "bias_current"),
            OffsetCurrentAmperes = s.ValueOr("offset_current", 0, Bound.Any, UnitKind.Ampere),
            Supply = supply,
            OutputSwingVolts = swing,
            InputCommonMode = VoltageRange(s, "input_common_mode"),
            SlewRateVoltsPerSecond = s.Quantity("slew_rate", Bound.Positive, UnitKind.VoltPerSecond)?.Value,
            NoiseVoltsPerRootHertz = s.ValueOr("noise_voltage", 0, Bound.NonNegative, UnitKind.VoltPerRootHertz),
            NoiseAmperesPerRootHertz = s.ValueOr("noise_current", 0, Bound.NonNegative, UnitKind.AmperePerRootHertz),
            NoiseCornerHertz = s.Quantity("noise_corner", Bound.Positive, UnitKind.Hertz)?.Value,
            IsolationResistorOhms = s.ValueOr("isolation_resistor", 0, Bound.NonNegative, UnitKind.Ohm),
            MinimumPhaseMarginDegrees = phaseMargin,
            Subcircuit = ReadSubcircuit(s),
        };
    }

    private static SubcircuitRef? ReadSubcircuit(TomlSection s)
    {
        var file = s.String("subckt_file");
        var name = s.String("subckt_name");
        if (file is null && name is null)
            return null;
        if (file is null)
            throw s.Missing("subckt_file", "subckt_name needs the file that defines it: subckt_file = \"opamp.lib\".");
        if (string.IsNullOrWhiteSpace(name))
            throw name is null
                ? s.Missing("subckt_name", "Name the .subckt to use from the file: subckt_name = \"...\".")
                : s.ErrorAtValue("subckt_name", "empty subcircuit name", "Name the .subckt to use from the file.");
        var (fullPath, text) = s.ReadFile("subckt_file", file);
        var library = SubcircuitParser.Parse(text, file, s.KeyPath("subckt_file"), (included, at, _) => Include(s, file, included, at));
        var definition = library.Find(name)
            ?? throw s.ErrorAtValue("subckt_name", $"the file {file} defines no .subckt {name}" +
                   (library.Subcircuits.Count == 0 ? "" : $" (it defines {string.Join(", ", library.Subcircuits.Select(d => d.Name))})"),
                   "Name one of the file's subcircuits.");
        if (definition.Pins.Count != 5)
            throw s.ErrorAtValue("subckt_name", $".subckt {name} has {definition.Pins.Count} pins; the buffer needs 5",
                "The pins in order: non-inverting input, inverting input, positive supply, negative supply, output.");
        return new SubcircuitRef(file, fullPath, name) { Netlist = library.Spice(file) };
    }

    /// <summary>A file a subcircuit file includes: resolved like every path of a design, inside the design's folder.</summary>
    private static (string FileName, string Text) Include(TomlSection s, string file, string included, SpiceToken at) =>
        SpiceIncludes.Read(s, included, at, new SubcircuitErrors(file, s.KeyPath("subckt_file")).At);

    internal static VoltageRange? VoltageRange(TomlSection s, string key) =>
        s.Range(key, UnitKind.Volt) is { } r ? new VoltageRange(r.Min, r.Max) : null;
}
