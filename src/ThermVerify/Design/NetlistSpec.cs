using ThermVerify.Design.Netlists;

namespace ThermVerify.Design;

/// <summary>A part of a netlist front end that carries a tolerance and a temperature coefficient ([[netlist.part]]).</summary>
public sealed record NetlistPartSpec(string Name, double Tolerance, double TempcoPerKelvin)
{
    /// <summary>The tempco was written with a sign (taken at it) rather than as a bound (<see cref="SignWritten"/>).</summary>
    public bool TempcoSigned { get; init; }
}

/// <summary>
/// A front end given as a SPICE netlist ([netlist]) instead of the built-in shape: the file (read strictly at load,
/// <see cref="NetlistParser"/>), the element or elements that are the sensor, the node the converter reads, the
/// node whose voltage is its reference when the converter is ratiometric, the sources that excite the sensor, and
/// the parts with a tolerance and tempco. Every other part sits at the board temperature without drift.
/// </summary>
public sealed record NetlistSpec
{
    /// <summary>The file as the design names it (relative to the design's folder).</summary>
    public required string File { get; init; }
    /// <summary>Where the file really lies, inside the design's folder.</summary>
    public required string FullPath { get; init; }
    /// <summary>The sensor's resistor or resistors, by element name as the netlist writes it.</summary>
    public required IReadOnlyList<string> SensorElements { get; init; }
    /// <summary>The converter's input node (lower case, as the netlist's nodes are read).</summary>
    public required string PinNode { get; init; }
    /// <summary>
    /// Our key `negative_pin`: the node the converter's negative input reads (a differential or pseudo-differential
    /// input, [adc] input), lower case; null for a single-ended input (against ground).
    /// </summary>
    public string? NegativePinNode { get; init; }
    /// <summary>The node whose voltage is the converter's reference (a ratiometric converter); null with a fixed reference.</summary>
    public string? ReferenceNode { get; init; }
    /// <summary>The sources that excite the sensor (V or I elements).</summary>
    public IReadOnlyList<string> Excitation { get; init; } = [];
    public IReadOnlyList<NetlistPartSpec> Parts { get; init; } = [];

    /// <summary>
    /// The resistor `choose-fixed` replaces with E-series values (our key `fixed`): the netlist's counterpart of a
    /// divider's fixed resistor, by element name as the netlist writes it; null when the design names none.
    /// </summary>
    public string? FixedElement { get; init; }

    /// <summary>
    /// The reference node's voltage: the DC value of the source that drives it from ground (the only way a reference node
    /// is read for now); null without a reference node.
    /// </summary>
    public double? ReferenceVolts { get; init; }

    /// <summary>
    /// Our key `switch_on_lead`: the excitation is switched on only to measure, this long before the first acquisition
    /// window opens (from the excitation's switch-on: a PULSE's delay TD, or t = 0 for a DC source, which steps from 0);
    /// null when the excitation is on all the time.
    /// </summary>
    public double? SwitchOnLeadSeconds { get; init; }

    /// <summary>Our key `reading_interval`: the time between readings of a switched excitation (the sensor's duty cycle for self-heating).</summary>
    public double? ReadingIntervalSeconds { get; init; }

    /// <summary>The netlist as read: flat, its parameters evaluated.</summary>
    internal ParsedNetlist Parsed { get; init; } = new("", []);

    /// <summary>Equal when they name the same file, the same elements and nodes and the same parts (the lists by their items).</summary>
    public bool Equals(NetlistSpec? other) =>
        other is not null && File == other.File && FullPath == other.FullPath && PinNode == other.PinNode && NegativePinNode == other.NegativePinNode && ReferenceNode == other.ReferenceNode
        && Nullable.Equals(ReferenceVolts, other.ReferenceVolts) && SensorElements.SequenceEqual(other.SensorElements)
        && Excitation.SequenceEqual(other.Excitation) && Parts.SequenceEqual(other.Parts) && FixedElement == other.FixedElement
        && Nullable.Equals(SwitchOnLeadSeconds, other.SwitchOnLeadSeconds) && Nullable.Equals(ReadingIntervalSeconds, other.ReadingIntervalSeconds)
        && Parsed.Elements.Count == other.Parsed.Elements.Count;

    public override int GetHashCode() => HashCode.Combine(File, PinNode, ReferenceNode, Parts.Count);

    /// <summary>
    /// The netlist with some elements' values scaled by (1 + fraction) (a built unit, a tolerance corner), by element
    /// name; the reference voltage follows the source that drives the reference node, so a ratiometric reference moves
    /// with it.
    /// </summary>
    internal NetlistSpec WithScaledValues(IReadOnlyDictionary<string, double> fractions)
    {
        var parsed = Parsed with
        {
            Elements = [.. Parsed.Elements.Select(e => fractions.TryGetValue(e.Name, out var f) ? Scaled(e, 1 + f) : e)],
        };
        return this with { Parsed = parsed, ReferenceVolts = ReferenceNode is { } node ? NetlistReader.ReferenceSourceVolts(parsed, node) : null };
    }

    /// <summary>An element's value times <paramref name="factor"/>; a PULSE's levels with it (the source's tolerance holds while it is off and on).</summary>
    private static NetlistElement Scaled(NetlistElement e, double factor) => e with
    {
        Value = e.Value * factor,
        Pulse = e.Pulse is { } p ? p with { Initial = p.Initial * factor, Pulsed = p.Pulsed * factor } : null,
    };

    /// <summary>The netlist with one element at another value (a candidate of `choose-fixed`).</summary>
    internal NetlistSpec WithValue(string element, double value)
    {
        var parsed = Parsed with
        {
            Elements = [.. Parsed.Elements.Select(e => e.Name.Equals(element, StringComparison.OrdinalIgnoreCase) ? e with { Value = value } : e)],
        };
        return this with { Parsed = parsed, ReferenceVolts = ReferenceNode is { } node ? NetlistReader.ReferenceSourceVolts(parsed, node) : null };
    }

    /// <summary>The netlist with one [[netlist.part]] entry changed (a remedy's tempco).</summary>
    internal NetlistSpec WithPart(string element, Func<NetlistPartSpec, NetlistPartSpec> change) => this with
    {
        Parts = [.. Parts.Select(p => p.Name.Equals(element, StringComparison.OrdinalIgnoreCase) ? change(p) : p)],
    };

    /// <summary>The part entry of an element, if the design gives one.</summary>
    public NetlistPartSpec? Part(string element) =>
        Parts.FirstOrDefault(p => p.Name.Equals(element, StringComparison.OrdinalIgnoreCase));
}
