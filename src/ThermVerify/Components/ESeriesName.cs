namespace ThermVerify.Components;

/// <summary>The IEC 60063 series of preferred numbers; the number is the count of values per decade.</summary>
public enum ESeriesName
{
    E6 = 6,
    E12 = 12,
    E24 = 24,
    E48 = 48,
    E96 = 96,
    E192 = 192,
}
