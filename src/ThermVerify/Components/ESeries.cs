using System.Globalization;

namespace ThermVerify.Components;

/// <summary>
/// An IEC 60063 series of preferred values (E6 … E192), usable in any decade, for resistors and capacitors alike.
/// </summary>
/// <remarks>
/// "Nearest" is by ratio (distance in log), because a series is spaced geometrically: 4.8k is nearer 4.7k
/// (2.1 %) than 5.1k (6.3 %). Values within one part in 10⁹ of a series value count as that value, so that
/// 4.7e-9 computed in floating point is still recognised as 4n7.
/// </remarks>
public sealed class ESeries
{
    private const double SameValueRelative = 1e-9;

    private static readonly Dictionary<ESeriesName, ESeries> Cache =
        Enum.GetValues<ESeriesName>().ToDictionary(n => n, n => new ESeries(n));

    private readonly int[] _hundredths;

    private ESeries(ESeriesName name)
    {
        Name = name;
        _hundredths = ESeriesValues.Hundredths(name);
        Mantissas = [.. _hundredths.Select(h => h / 100.0)];
    }

    public static ESeries E6 => Get(ESeriesName.E6);
    public static ESeries E12 => Get(ESeriesName.E12);
    public static ESeries E24 => Get(ESeriesName.E24);
    public static ESeries E48 => Get(ESeriesName.E48);
    public static ESeries E96 => Get(ESeriesName.E96);
    public static ESeries E192 => Get(ESeriesName.E192);

    public ESeriesName Name { get; }

    /// <summary>The values of one decade, 1.0 ≤ m &lt; 10, ascending, as IEC 60063 prints them.</summary>
    public IReadOnlyList<double> Mantissas { get; }

    public static ESeries Get(ESeriesName name) =>
        Cache.TryGetValue(name, out var series) ? series
            : throw new ArgumentOutOfRangeException(nameof(name), name, "Not an IEC 60063 series; use E6, E12, E24, E48, E96 or E192.");

    /// <summary>"E6" … "E192", case-insensitive, surrounding blanks ignored.</summary>
    public static ESeries Get(string name) =>
        TryParse(name, out var series) ? series
            : throw new ArgumentException($"Unknown E-series '{name}'; use one of E6, E12, E24, E48, E96, E192 (IEC 60063).", nameof(name));

    public static bool TryParse(string? name, out ESeries series)
    {
        series = null!;
        var key = name?.Trim() ?? "";
        if (key.Length < 2 || (key[0] != 'E' && key[0] != 'e')
            || !int.TryParse(key.AsSpan(1), NumberStyles.None, CultureInfo.InvariantCulture, out var n)
            || !Enum.IsDefined((ESeriesName)n))
            return false;
        series = Get((ESeriesName)n);
        return true;
    }

    /// <summary>The series value nearest by ratio; a tie goes to the lower value.</summary>
    public double Nearest(double value)
    {
        var (decade, index, exact) = Locate(value);
        if (exact) return Scale(_hundredths[index], decade);
        var (lowH, lowD) = (_hundredths[index], decade);
        var (highH, highD) = Above(index, decade);
        var low = Scale(lowH, lowD);
        var high = Scale(highH, highD);
        return Math.Log(value / low) <= Math.Log(high / value) ? low : high;
    }

    /// <summary>The smallest series value strictly above <paramref name="value"/>.</summary>
    public double NextHigher(double value)
    {
        var (decade, index, _) = Locate(value);
        var (h, d) = Above(index, decade);
        return Scale(h, d);
    }

    /// <summary>The largest series value strictly below <paramref name="value"/>.</summary>
    public double NextLower(double value)
    {
        var (decade, index, exact) = Locate(value);
        if (!exact) return Scale(_hundredths[index], decade);
        return index > 0 ? Scale(_hundredths[index - 1], decade) : Scale(_hundredths[^1], decade - 1);
    }

    /// <summary>True when <paramref name="value"/> is a member of this series in some decade.</summary>
    public bool Contains(double value) => Locate(value).Exact;

    public override string ToString() => Name.ToString();

    /// <summary>Decade exponent, index of the largest series value ≤ value, and whether it equals value.</summary>
    private (int Decade, int Index, bool Exact) Locate(double value)
    {
        if (!double.IsFinite(value) || value <= 0)
            throw new ArgumentOutOfRangeException(nameof(value), value,
                $"An E-series value is looked up for a positive finite value; got {value.ToString("G6", CultureInfo.InvariantCulture)}.");
        var decade = (int)Math.Floor(Math.Log10(value));
        var mantissa = Unscale(value, decade);
        // Log10 can land one decade off right at a power of ten.
        if (mantissa >= 10 * (1 - SameValueRelative)) { decade++; mantissa = Unscale(value, decade); }
        else if (mantissa < 1 * (1 - SameValueRelative)) { decade--; mantissa = Unscale(value, decade); }

        var index = _hundredths.Length - 1;
        while (index > 0 && _hundredths[index] / 100.0 > mantissa * (1 + SameValueRelative)) index--;
        var exact = Math.Abs(mantissa - _hundredths[index] / 100.0) <= SameValueRelative * mantissa;
        return (decade, index, exact);
    }

    private (int Hundredths, int Decade) Above(int index, int decade) =>
        index + 1 < _hundredths.Length ? (_hundredths[index + 1], decade) : (_hundredths[0], decade + 1);

    // Multiplying or dividing by an exact power of ten rounds once, so 470 and −11 give exactly the double nearest 4.7e-9.
    private static double Scale(int hundredths, int decade) =>
        decade - 2 >= 0 ? hundredths * Math.Pow(10, decade - 2) : hundredths / Math.Pow(10, 2 - decade);

    private static double Unscale(double value, int decade) =>
        decade >= 0 ? value / Math.Pow(10, decade) : value * Math.Pow(10, -decade);
}
