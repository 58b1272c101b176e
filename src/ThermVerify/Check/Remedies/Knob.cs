using System.Globalization;
using ThermVerify.Design;

namespace ThermVerify.Check.Remedies;

/// <summary>Which way a design value must move to shrink an effect.</summary>
internal enum Better { Higher, Lower }

/// <summary>
/// A design value a remedy may change: its key, how to read it and set it in a copy of the design, which way helps,
/// where a search starts when the design does not have the part at all (<see cref="Floor"/>: no reservoir, no buffer),
/// how far it may go (<see cref="Limit"/>), and the words of the remedy. Values that have a sign (an offset, a tempco,
/// a leakage) are searched by magnitude and keep their sign. A search never starts past the design's own value, so a
/// remedy never asks for what the design already has or exceeds.
/// </summary>
internal sealed record Knob(
    string Key,
    string Unit,
    Better Better,
    Func<FrontEndDesign, double?> Current,
    Func<FrontEndDesign, double, FrontEndDesign> Apply,
    Func<FrontEndDesign, double> Limit,
    string Action)
{
    /// <summary>Where an upward search starts when the design does not have the part (<see cref="Current"/> is null).</summary>
    public Func<FrontEndDesign, double> Floor { get; init; } = _ => double.NaN;

    /// <summary>The words for bringing a signed value to zero (calibrating an offset out, a resistor with no tempco).</summary>
    public string? Removal { get; init; }

    /// <summary>
    /// A one-point calibration (firmware, or a trim at assembly) removes it: an offset, a gain error. In a combination
    /// these go first, before the parts a calibration leaves (drift, INL).
    /// </summary>
    public bool Calibrated { get; init; }

    /// <summary>Whole numbers only (bits).</summary>
    public bool Integer { get; init; }

    /// <summary>Rounds a found value to a standard one (E12 for capacitors); otherwise to three significant digits.</summary>
    public Func<double, double>? Standard { get; init; }

    /// <summary>Rounds a found value to what the remedy prints and the proof checks: up for "at least", down for "at most".</summary>
    public double Round(double value)
    {
        if (Integer) return Better == Better.Higher ? Math.Ceiling(value - 1e-9) : Math.Floor(value + 1e-9);
        if (Standard is { } standard) return standard(value);
        if (value == 0 || !double.IsFinite(value)) return value;
        var scale = Math.Pow(10, Math.Floor(Math.Log10(Math.Abs(value))) - 2);
        var units = value / scale;
        return (Better == Better.Higher ? Math.Ceiling(units - 1e-9) : Math.Floor(units + 1e-9)) * scale;
    }

    public override string ToString() => string.Create(CultureInfo.InvariantCulture, $"{Key} ({Better})");
}
