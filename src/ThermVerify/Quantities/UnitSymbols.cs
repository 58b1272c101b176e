namespace ThermVerify.Quantities;

/// <summary>How each unit kind is spelled when read, printed and described in error messages.</summary>
internal static class UnitSymbols
{
    /// <summary>Spellings that take an SI prefix, e.g. kΩ, mV, nF, µs, kHz, mK.</summary>
    private static readonly Dictionary<string, UnitKind> Prefixable = new(StringComparer.Ordinal)
    {
        ["\u03A9"] = UnitKind.Ohm, // Ω Greek capital omega
        ["\u2126"] = UnitKind.Ohm, // Ω ohm sign
        ["ohm"] = UnitKind.Ohm,
        ["ohms"] = UnitKind.Ohm,
        ["Ohm"] = UnitKind.Ohm,
        ["Ohms"] = UnitKind.Ohm,
        ["V"] = UnitKind.Volt,
        ["A"] = UnitKind.Ampere,
        ["F"] = UnitKind.Farad,
        ["s"] = UnitKind.Second,
        ["Hz"] = UnitKind.Hertz,
        ["K"] = UnitKind.Kelvin,
        ["C"] = UnitKind.Coulomb,
    };

    /// <summary>Spellings that take no prefix.</summary>
    private static readonly Dictionary<string, UnitKind> Plain = new(StringComparer.Ordinal)
    {
        ["\u00B0C"] = UnitKind.Celsius, // °C
        ["\u2103"] = UnitKind.Celsius,  // ℃
        ["degC"] = UnitKind.Celsius,
        ["%"] = UnitKind.Percent,
        ["ppm"] = UnitKind.Ppm,
        ["dB"] = UnitKind.Decibel,
        ["LSB"] = UnitKind.Lsb,
        ["\u00B0"] = UnitKind.Degree, // °
        ["deg"] = UnitKind.Degree,
    };

    /// <summary>Numerators of compound units; W stands for the watt of W/K.</summary>
    private static readonly Dictionary<string, UnitKind> Numerators = new(StringComparer.Ordinal)
    {
        ["V"] = UnitKind.Volt,
        ["A"] = UnitKind.Ampere,
        ["W"] = UnitKind.WattPerKelvin,
        ["K"] = UnitKind.Kelvin,
    };

    private static readonly Dictionary<string, UnitKind> SecondsDenominator = new(StringComparer.Ordinal) { ["s"] = UnitKind.Second };

    private static readonly HashSet<string> RootHertz = new(StringComparer.Ordinal)
    {
        "\u221AHz", "rtHz", "sqrtHz", "sqrt(Hz)",
    };

    private static readonly HashSet<string> KelvinDenominator = new(StringComparer.Ordinal)
    {
        "K", "\u00B0C", "degC",
    };

    /// <summary>Power of ten that turns the written unit into the stored SI value (or fraction).</summary>
    public static int StorageExponent(UnitKind kind) => kind switch
    {
        UnitKind.Percent => -2,
        UnitKind.Ppm or UnitKind.PpmPerKelvin => -6,
        _ => 0,
    };

    /// <summary>Reads a unit spelling such as "kΩ", "nV/rtHz", "V/µs", "ppm/K".</summary>
    /// <param name="exponent">Power of ten to apply to the written number to get the SI value.</param>
    /// <param name="hasPrefix">Whether the spelling carried an SI prefix.</param>
    public static bool TryRead(string symbol, out UnitKind kind, out int exponent, out bool hasPrefix)
    {
        kind = default;
        exponent = 0;
        hasPrefix = false;
        if (Plain.TryGetValue(symbol, out kind))
        {
            exponent = StorageExponent(kind);
            return true;
        }
        if (TryPrefixed(symbol, Prefixable, out kind, out exponent, out hasPrefix))
            return true;
        var slash = symbol.IndexOf('/');
        if (slash <= 0 || slash == symbol.Length - 1)
            return false;
        return TryCompound(symbol[..slash], symbol[(slash + 1)..], out kind, out exponent, out hasPrefix);
    }

    private static bool TryCompound(string numerator, string denominator, out UnitKind kind, out int exponent, out bool hasPrefix)
    {
        kind = default;
        exponent = 0;
        hasPrefix = false;
        if (numerator == "ppm" && KelvinDenominator.Contains(denominator))
        {
            kind = UnitKind.PpmPerKelvin;
            exponent = StorageExponent(kind);
            return true;
        }
        if (!TryPrefixed(numerator, Numerators, out var top, out var topExponent, out hasPrefix))
            return false;
        exponent = topExponent;
        if (top == UnitKind.Volt && TryPrefixed(denominator, SecondsDenominator, out _, out var bottomExponent, out var bottomPrefix))
        {
            kind = UnitKind.VoltPerSecond;
            exponent -= bottomExponent;
            hasPrefix |= bottomPrefix;
            return true;
        }
        if (top is UnitKind.Volt or UnitKind.Ampere && RootHertz.Contains(denominator))
        {
            kind = top == UnitKind.Volt ? UnitKind.VoltPerRootHertz : UnitKind.AmperePerRootHertz;
            return true;
        }
        if (top == UnitKind.Kelvin && denominator == "s")
        {
            kind = UnitKind.KelvinPerSecond;
            return true;
        }
        if (top == UnitKind.Volt && KelvinDenominator.Contains(denominator))
        {
            kind = UnitKind.VoltPerKelvin;
            return true;
        }
        if (top == UnitKind.WattPerKelvin && KelvinDenominator.Contains(denominator))
        {
            kind = UnitKind.WattPerKelvin;
            return true;
        }
        return false;
    }

    private static bool TryPrefixed(string symbol, Dictionary<string, UnitKind> table, out UnitKind kind, out int exponent, out bool hasPrefix)
    {
        exponent = 0;
        hasPrefix = false;
        if (table.TryGetValue(symbol, out kind))
            return true;
        if (symbol.Length > 1 && SiPrefixes.TryGetExponent(symbol[0], out exponent) && table.TryGetValue(symbol[1..], out kind))
        {
            hasPrefix = true;
            return true;
        }
        exponent = 0;
        return false;
    }

    /// <summary>Whether a unit kind is printed with an SI prefix.</summary>
    public static bool TakesPrefix(UnitKind kind) => kind is UnitKind.Ohm or UnitKind.Volt or UnitKind.Ampere
        or UnitKind.Farad or UnitKind.Second or UnitKind.Hertz or UnitKind.Kelvin or UnitKind.WattPerKelvin
        or UnitKind.VoltPerSecond or UnitKind.VoltPerRootHertz or UnitKind.AmperePerRootHertz or UnitKind.VoltPerKelvin
        or UnitKind.KelvinPerSecond or UnitKind.Coulomb;

    /// <summary>The symbol printed after the (prefixed) number.</summary>
    public static string PrintedSymbol(UnitKind kind) => kind switch
    {
        UnitKind.Dimensionless => "",
        UnitKind.Ohm => "\u03A9",
        UnitKind.Volt => "V",
        UnitKind.Ampere => "A",
        UnitKind.Farad => "F",
        UnitKind.Second => "s",
        UnitKind.Hertz => "Hz",
        UnitKind.Kelvin => "K",
        UnitKind.Celsius => "\u00B0C",
        UnitKind.Percent => "%",
        UnitKind.Ppm => "ppm",
        UnitKind.PpmPerKelvin => "ppm/K",
        UnitKind.Decibel => "dB",
        UnitKind.WattPerKelvin => "W/K",
        UnitKind.VoltPerSecond => "V/\u00B5s",
        UnitKind.VoltPerRootHertz => "V/\u221AHz",
        UnitKind.AmperePerRootHertz => "A/\u221AHz",
        UnitKind.Lsb => "LSB",
        UnitKind.VoltPerKelvin => "V/K",
        UnitKind.Degree => "\u00B0",
        UnitKind.KelvinPerSecond => "K/s",
        UnitKind.Coulomb => "C",
        _ => throw new ArgumentOutOfRangeException(nameof(kind)),
    };

    /// <summary>What a value of this kind is, with examples, for error messages.</summary>
    public static string Describe(UnitKind kind) => kind switch
    {
        UnitKind.Dimensionless => "a plain number (e.g. 12 or 3.5e-3)",
        UnitKind.Ohm => "a resistance (e.g. \"4.7 kohm\", \"4k7\", \"100 \u03A9\")",
        UnitKind.Volt => "a voltage (e.g. \"3.3 V\", \"12 mV\")",
        UnitKind.Ampere => "a current (e.g. \"1 nA\", \"50 pA\")",
        UnitKind.Farad => "a capacitance (e.g. \"100 nF\", \"4n7\")",
        UnitKind.Second => "a time (e.g. \"1.5 us\", \"2 ms\")",
        UnitKind.Hertz => "a frequency (e.g. \"10 kHz\")",
        UnitKind.Kelvin => "a temperature difference in K (e.g. \"1 K\", \"500 mK\")",
        UnitKind.Celsius => "a temperature in degC (e.g. \"25 degC\", \"-40 \u00B0C\")",
        UnitKind.Percent => "a percentage (e.g. \"1 %\")",
        UnitKind.Ppm => "parts per million (e.g. \"50 ppm\")",
        UnitKind.PpmPerKelvin => "a temperature coefficient (e.g. \"25 ppm/K\")",
        UnitKind.Decibel => "a gain in dB (e.g. \"100 dB\")",
        UnitKind.WattPerKelvin => "a dissipation constant (e.g. \"2 mW/K\")",
        UnitKind.VoltPerSecond => "a slew rate (e.g. \"0.5 V/us\")",
        UnitKind.VoltPerRootHertz => "a noise density (e.g. \"20 nV/rtHz\")",
        UnitKind.AmperePerRootHertz => "a current noise density (e.g. \"0.5 pA/rtHz\")",
        UnitKind.Lsb => "an error in LSB (e.g. \"1 LSB\", \"0.5 LSB\")",
        UnitKind.VoltPerKelvin => "a voltage drift (e.g. \"5 uV/K\")",
        UnitKind.Degree => "an angle in degrees (e.g. \"45 deg\")",
        UnitKind.KelvinPerSecond => "a rate of temperature change (e.g. \"0.5 K/s\", \"20 mK/s\")",
        UnitKind.Coulomb => "a charge (e.g. \"2 pC\", \"-500 fC\")",
        _ => throw new ArgumentOutOfRangeException(nameof(kind)),
    };

    /// <summary>Kinds that are never negative, whatever the key: a negative one is a typo, not a design.</summary>
    public static bool IsNonNegative(UnitKind kind) => kind is UnitKind.Ohm or UnitKind.Farad or UnitKind.Second
        or UnitKind.Hertz or UnitKind.WattPerKelvin or UnitKind.VoltPerSecond or UnitKind.VoltPerRootHertz
        or UnitKind.AmperePerRootHertz;
}
