using System.Text;

namespace ThermVerify.Circuits.Spice;

/// <summary>
/// What an element writes into a deck: its instance lines, and models or subcircuits it needs once (collected
/// separately so the deck lists them after the netlist). Instance names get the SPICE type letter in front when the
/// element's own name does not start with it, since SPICE decides the element type by that letter.
/// </summary>
internal sealed class SpiceLines
{
    private readonly StringBuilder netlist = new();
    private readonly List<string> definitions = [];
    private readonly HashSet<string> definitionKeys = [];

    /// <summary>The simulation stop time of a transient deck (switch controls are written up to it), else null.</summary>
    public double? StopTimeSeconds { get; init; }

    /// <summary>The circuit temperature in °C, for the few values that must be fixed at it (noise scaling).</summary>
    public double TemperatureCelsius { get; init; } = 25;

    /// <summary>
    /// True in a <c>.dc temp</c> deck: temperature-dependent values are written as expressions in <c>temper</c>.
    /// Otherwise they are written as their value at the deck's temperature, because ngspice turns a resistor with a
    /// <c>temper</c> expression into a behavioural one that has no thermal noise.
    /// </summary>
    public bool SweepsTemperature { get; init; }

    /// <summary>Noise-only generators (the op-amp's) are written for a noise deck alone, to keep other decks lean.</summary>
    public bool WritesNoiseSources { get; init; }

    public static string InstanceName(char letter, string name) =>
        char.ToUpperInvariant(name[0]) == char.ToUpperInvariant(letter) ? name : $"{letter}{name}";

    public void Comment(string text) => netlist.Append("* ").AppendLine(text);

    public void Line(string text) => netlist.AppendLine(text);

    /// <summary>A .model or .subckt block, written once however many elements ask for it.</summary>
    public void Definition(string key, string text)
    {
        if (definitionKeys.Add(key)) definitions.Add(text.TrimEnd());
    }

    public string Netlist => netlist.ToString();

    public IReadOnlyList<string> Definitions => definitions;
}
