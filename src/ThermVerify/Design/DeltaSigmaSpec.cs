namespace ThermVerify.Design;

/// <summary>How the converter turns the input into codes.</summary>
public enum ConverterKind
{
    /// <summary>A successive-approximation converter: one acquisition window per conversion ([adc] without kind, or kind = "successive-approximation").</summary>
    SuccessiveApproximation,
    /// <summary>A delta-sigma converter: the input sampled at the modulator rate, the reading made by a digital filter (<see cref="DeltaSigmaSpec"/>).</summary>
    DeltaSigma,
}

/// <summary>The digital filter of a delta-sigma converter.</summary>
public enum DigitalFilterKind
{
    /// <summary>sinc^N: N cascaded moving averages of the decimation length M = f_mod/f_data at the modulator rate.</summary>
    Sinc,
    /// <summary>A sinc^N stage followed by the mean of L of its outputs; the data rate is the rate after the mean.</summary>
    SincAverage,
}

/// <summary>The converter's own rms noise, input-referred, at one data rate and gain (one row of [[adc.noise_table]]).</summary>
public sealed record NoiseAtRate(double DataRateHertz, double Gain, double RmsVolts);

/// <summary>
/// A delta-sigma converter's input and digital filter ([adc] kind = "delta-sigma"). The input is sampled continuously
/// at the modulator rate: unbuffered, each modulator period charges the sampling capacitance from the pin (an average
/// load R_eq = 1/(f_mod·C)); buffered, the pin sees only the buffer's input current. The reading is the output of the
/// digital filter, decimated to the data rate.
/// </summary>
public sealed record DeltaSigmaSpec
{
    public required double ModulatorRateHertz { get; init; }
    /// <summary>Readings per second of one channel while it is selected (the filter's output rate).</summary>
    public required double DataRateHertz { get; init; }
    public required bool InputBuffered { get; init; }
    /// <summary>The input's sampling capacitance (unbuffered input); 0 with the buffer on.</summary>
    public double SamplingCapacitanceFarads { get; init; }
    /// <summary>The buffer's input current, positive into the pin (buffered input); 0 without the buffer.</summary>
    public double InputCurrentAmperes { get; init; }
    /// <summary>Whether the input current was written with a sign (otherwise a bound taken at the worse sign).</summary>
    public bool InputCurrentSigned { get; init; }
    /// <summary>The programmable gain ahead of the modulator: full scale at the input is the reference over the gain.</summary>
    public double Gain { get; init; } = 1;
    public required DigitalFilterKind Filter { get; init; }
    /// <summary>N of the sinc^N stage.</summary>
    public required int FilterOrder { get; init; }
    /// <summary>L, the outputs of the sinc stage the averaging filter takes the mean of (1 for a plain sinc^N).</summary>
    public int AverageLength { get; init; } = 1;
    /// <summary>Whether the converter clears the filter's memory when the multiplexer changes channel.</summary>
    public bool FilterReset { get; init; } = true;
    /// <summary>
    /// Whether the RC filter follows the multiplexer, shared by the channels (it holds the other channel's voltage at a
    /// switch), rather than each channel having its own ahead of it (it holds its own voltage, unloaded by the converter).
    /// </summary>
    public bool SharedFilter { get; init; }
    /// <summary>Readings the firmware throws away after a channel switch before it uses one.</summary>
    public int ReadingsDiscarded { get; init; }
    /// <summary>The converter's rms noise against data rate and gain ([[adc.noise_table]]); empty: not declared this way.</summary>
    public IReadOnlyList<NoiseAtRate> NoiseTable { get; init; } = [];
    /// <summary>The frequencies whose rejection is reported (50 Hz and 60 Hz unless the design lists others).</summary>
    public IReadOnlyList<double> RejectionHertz { get; init; } = [50, 60];
    /// <summary>An interference amplitude (peak) declared at the sensor at those frequencies; null: none declared.</summary>
    public double? InterferenceVolts { get; init; }

    /// <summary>The decimation length M of the sinc stage, in modulator samples (f_mod / (f_data·L)).</summary>
    public int Decimation => (int)Math.Round(ModulatorRateHertz / (DataRateHertz * AverageLength));

    /// <summary>The row of the noise table at this data rate and gain; null when the table has none.</summary>
    public NoiseAtRate? TableNoise => NoiseTable.FirstOrDefault(r => SameRate(r.DataRateHertz, DataRateHertz) && SameRate(r.Gain, Gain));

    internal static bool SameRate(double a, double b) => Math.Abs(a - b) <= 1e-9 * Math.Max(Math.Abs(a), Math.Abs(b));

    // Records compare lists by reference; a design loaded twice must compare equal.
    public bool Equals(DeltaSigmaSpec? other) =>
        other is not null && ModulatorRateHertz == other.ModulatorRateHertz && DataRateHertz == other.DataRateHertz
        && InputBuffered == other.InputBuffered && SamplingCapacitanceFarads == other.SamplingCapacitanceFarads
        && InputCurrentAmperes == other.InputCurrentAmperes && InputCurrentSigned == other.InputCurrentSigned && Gain == other.Gain
        && Filter == other.Filter && FilterOrder == other.FilterOrder && AverageLength == other.AverageLength
        && FilterReset == other.FilterReset && SharedFilter == other.SharedFilter && ReadingsDiscarded == other.ReadingsDiscarded
        && NoiseTable.SequenceEqual(other.NoiseTable) && RejectionHertz.SequenceEqual(other.RejectionHertz)
        && InterferenceVolts == other.InterferenceVolts;

    public override int GetHashCode() => HashCode.Combine(ModulatorRateHertz, DataRateHertz, Filter, FilterOrder, AverageLength, Gain);
}
