using ThermVerify.Sensors;

namespace ThermVerify.Design;

/// <summary>A part of the checked range with its own error budget.</summary>
public sealed record CheckRegion(TemperatureRange Range, double BudgetKelvin);

/// <summary>What to verify: the temperature range, the sweep step and the error budgets.</summary>
public sealed record CheckSpec
{
    public required TemperatureRange Range { get; init; }
    public double StepKelvin { get; init; } = DesignDefaults.StepKelvin;
    public required double BudgetKelvin { get; init; }
    /// <summary>The sampled voltage must settle to within this many LSB of its final value.</summary>
    public double SettleLimitLsb { get; init; } = DesignDefaults.SettleLimitLsb;
    /// <summary>
    /// Temperature of the electronics (fixed resistor tempco, ADC pin leakage). Null: the whole unit sits at
    /// the swept temperature, as in a SPICE temperature sweep; a value: only the sensor follows the sweep.
    /// </summary>
    public double? BoardCelsius { get; init; }
    /// <summary>Tighter or looser budgets over parts of the range; where regions overlap the smallest budget applies.</summary>
    public IReadOnlyList<CheckRegion> Regions { get; init; } = [];

    /// <summary>The budget at a temperature: the smallest of the regions that contain it, else the overall budget.</summary>
    public double BudgetAt(double celsius) =>
        Regions.Where(r => r.Range.Contains(celsius)).Select(r => r.BudgetKelvin).DefaultIfEmpty(BudgetKelvin).Min();

    public bool Equals(CheckSpec? other) =>
        other is not null && Range == other.Range && StepKelvin.Equals(other.StepKelvin)
        && BudgetKelvin.Equals(other.BudgetKelvin) && SettleLimitLsb.Equals(other.SettleLimitLsb)
        && Nullable.Equals(BoardCelsius, other.BoardCelsius)
        && Regions.SequenceEqual(other.Regions);

    public override int GetHashCode() => HashCode.Combine(Range, StepKelvin, BudgetKelvin, SettleLimitLsb, Regions.Count);
}
