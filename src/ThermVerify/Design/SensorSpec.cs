using ThermVerify.Sensors;

namespace ThermVerify.Design;

/// <summary>The [sensor] section: which R(T) model and its parameters. <see cref="Build"/> makes the model.</summary>
public abstract record SensorSpec
{
    /// <summary>The value of the design file's <c>model</c> key.</summary>
    public abstract string ModelName { get; }

    /// <summary>Self-heating: power per kelvin of rise (IEC 60539-1 dissipation constant); null: not evaluated.</summary>
    public double? DissipationConstantWattsPerKelvin { get; init; }

    public abstract ISensorModel Build();
}

/// <summary>NTC, Beta model.</summary>
internal sealed record BetaSensorSpec : SensorSpec
{
    public override string ModelName => "beta";
    public required double R0Ohms { get; init; }
    /// <summary>Temperature at which <see cref="R0Ohms"/> holds (25 °C for R25).</summary>
    public double ReferenceCelsius { get; init; } = DesignDefaults.ReferenceCelsius;
    public required double BetaKelvin { get; init; }
    /// <summary>The pair of temperatures β was specified between, e.g. B25/85.</summary>
    public double BetaFromCelsius { get; init; } = DesignDefaults.BetaFromCelsius;
    public double BetaToCelsius { get; init; } = DesignDefaults.BetaToCelsius;
    /// <summary>Fraction, tolerance of R0.</summary>
    public double ResistanceTolerance { get; init; } = DesignDefaults.Tolerance;
    /// <summary>Fraction, tolerance of β.</summary>
    public double BetaTolerance { get; init; } = DesignDefaults.Tolerance;
    /// <summary>Null: the model's own range.</summary>
    public TemperatureRange? ValidRange { get; init; }

    public override ISensorModel Build() =>
        new BetaThermistor(R0Ohms, BetaKelvin, ReferenceCelsius, ValidRange, BetaFromCelsius, BetaToCelsius);
}

/// <summary>NTC, Steinhart–Hart coefficients (1/K, with R in Ω).</summary>
internal sealed record SteinhartHartSensorSpec : SensorSpec
{
    public override string ModelName => "steinhart-hart";
    public required double A { get; init; }
    public required double B { get; init; }
    public required double C { get; init; }
    /// <summary>Coefficient of (ln R)²; 0 in the classic three-term form.</summary>
    public double D { get; init; }
    public double ResistanceTolerance { get; init; } = DesignDefaults.Tolerance;
    public TemperatureRange? ValidRange { get; init; }

    public override ISensorModel Build() => new SteinhartHartThermistor(A, B, C, D, ValidRange);
}

/// <summary>NTC from an R–T table in a CSV file next to the design.</summary>
internal sealed record TableSensorSpec : SensorSpec
{
    public override string ModelName => "table";
    /// <summary>As written in the design file, relative to it.</summary>
    public required string File { get; init; }
    public required string FullPath { get; init; }

    /// <summary>The table as read once at load time (checked where it lies, how large it is, what it is).</summary>
    public required string Text { get; init; }

    public double ResistanceTolerance { get; init; } = DesignDefaults.Tolerance;

    public override ISensorModel Build() => TableThermistor.Parse(Text, FullPath);
}

/// <summary>IEC 60751 tolerance classes of platinum RTDs.</summary>
internal enum RtdClass { AA, A, B, C }

/// <summary>Platinum RTD, Callendar–Van Dusen with IEC 60751 coefficients unless overridden.</summary>
internal sealed record RtdSensorSpec : SensorSpec
{
    public override string ModelName => "rtd";
    public required double R0Ohms { get; init; }
    /// <summary>Null: no class stated, the sensor is taken as exact.</summary>
    public RtdClass? ToleranceClass { get; init; }
    public double A { get; init; } = PlatinumRtd.IecA;
    public double B { get; init; } = PlatinumRtd.IecB;
    public double C { get; init; } = PlatinumRtd.IecC;

    public override ISensorModel Build() => new PlatinumRtd(R0Ohms, A, B, C);
}
