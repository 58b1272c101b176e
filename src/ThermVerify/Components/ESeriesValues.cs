namespace ThermVerify.Components;

/// <summary>
/// The IEC 60063 values of one decade as integers in hundredths (100 = 1.00), so membership tests are exact.
/// </summary>
/// <remarks>
/// E24 is written out as the standard prints it: eight of its values (2.7 3.0 3.3 3.6 3.9 4.3 4.7 8.2) differ from
/// round(10^(i/24), 1), which gives 2.6 2.9 3.2 3.5 3.8 4.2 4.6 8.3. E12 and E6 are every second and fourth E24 value.
/// E48, E96 and E192 are round(10^(i/n), 2); none of those values lies near a rounding midpoint (closest is
/// 1.1006 → 1.10), so double arithmetic reproduces them. One exception, from memory of the printed standard:
/// E192 position 185 is 9.20 although 10^(185/192) = 9.1948 rounds to 9.19.
/// </remarks>
internal static class ESeriesValues
{
    private static readonly int[] E24 =
        [100, 110, 120, 130, 150, 160, 180, 200, 220, 240, 270, 300, 330, 360, 390, 430, 470, 510, 560, 620, 680, 750, 820, 910];

    public static int[] Hundredths(ESeriesName name) => name switch
    {
        ESeriesName.E6 => EveryNth(4),
        ESeriesName.E12 => EveryNth(2),
        ESeriesName.E24 => [.. E24],
        ESeriesName.E48 or ESeriesName.E96 => Formula((int)name),
        ESeriesName.E192 => E192(),
        _ => throw new ArgumentOutOfRangeException(nameof(name), name, "Not an IEC 60063 series."),
    };

    private static int[] EveryNth(int step) => [.. E24.Where((_, i) => i % step == 0)];

    private static int[] Formula(int n) =>
        [.. Enumerable.Range(0, n).Select(i => (int)Math.Round(Math.Pow(10, (double)i / n) * 100, MidpointRounding.AwayFromZero))];

    private static int[] E192()
    {
        var values = Formula(192);
        values[185] = 920;
        return values;
    }
}
