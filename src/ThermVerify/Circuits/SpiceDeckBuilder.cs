using System.Globalization;
using System.Text;

namespace ThermVerify.Circuits;

/// <summary>Collects the lines of a SPICE deck while elements write their cards.</summary>
internal sealed class SpiceDeckBuilder(double temperatureCelsius)
{
    /// <summary>The circuit temperature, for elements written as fixed values.</summary>
    public double TemperatureCelsius { get; } = temperatureCelsius;

    private readonly StringBuilder cards = new();
    private readonly StringBuilder models = new();

    /// <summary>A number as SPICE reads it: invariant culture, round-trip digits, exponent form.</summary>
    public static string Number(double value) => value.ToString("R", CultureInfo.InvariantCulture);

    /// <summary>A SPICE instance name: the type letter, then the element's own name.</summary>
    public static string Name(char letter, string name) => $"{letter}_{name}";

    public void Card(string line) => cards.AppendLine(line);

    public void Comment(string text) => cards.AppendLine($"* {text}");

    public void Model(string line) => models.AppendLine(line);

    public string Cards => cards.ToString();

    public string Models => models.ToString();
}
