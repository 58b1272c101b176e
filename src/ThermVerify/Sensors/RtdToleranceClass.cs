using System.Globalization;

namespace ThermVerify.Sensors;

/// <summary>
/// An IEC 60751 tolerance class for platinum RTDs: the permitted deviation is ±(a + b·|t|) °C.
/// </summary>
/// <remarks>
/// Values: IEC 60751 (2008), tolerance classes table: AA 0.1 + 0.0017|t|, A 0.15 + 0.002|t|,
/// B 0.3 + 0.005|t|; class C 0.6 + 0.01|t| from memory. The standard also limits each class to a temperature
/// span (different for wire-wound and film elements); that is not modelled here.
/// </remarks>
internal sealed record RtdToleranceClass(string Name, double ConstantKelvin, double PerKelvinOfTemperature)
{
    public static readonly RtdToleranceClass AA = new("AA", 0.1, 0.0017);
    public static readonly RtdToleranceClass A = new("A", 0.15, 0.002);
    public static readonly RtdToleranceClass B = new("B", 0.3, 0.005);
    public static readonly RtdToleranceClass C = new("C", 0.6, 0.01);

    public static IReadOnlyList<RtdToleranceClass> All { get; } = [AA, A, B, C];

    /// <summary>Half-width of the permitted band, in K, at <paramref name="temperatureCelsius"/>.</summary>
    public double ToleranceKelvin(double temperatureCelsius) => ConstantKelvin + PerKelvinOfTemperature * Math.Abs(temperatureCelsius);

    /// <summary>"AA", "A", "B" or "C", case-insensitive; an optional "class " prefix is accepted.</summary>
    public static RtdToleranceClass Parse(string name)
    {
        ArgumentNullException.ThrowIfNull(name);
        var key = name.Trim();
        if (key.StartsWith("class ", StringComparison.OrdinalIgnoreCase)) key = key[6..].Trim();
        return All.FirstOrDefault(c => string.Equals(c.Name, key, StringComparison.OrdinalIgnoreCase))
            ?? throw new ArgumentException($"Unknown IEC 60751 tolerance class '{name}'; use one of AA, A, B, C.", nameof(name));
    }

    public override string ToString() => string.Create(CultureInfo.InvariantCulture,
        $"IEC 60751 class {Name}: ±({ConstantKelvin:0.###} + {PerKelvinOfTemperature:0.####}·|t|) °C");
}
