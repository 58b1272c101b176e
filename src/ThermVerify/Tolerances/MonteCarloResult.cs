namespace ThermVerify.Tolerances;

/// <summary>The spread of the reading error at one temperature over the units.</summary>
public sealed record EnvelopePoint(
    double Celsius,
    double BudgetKelvin,
    double NominalErrorKelvin,
    double MinKelvin,
    IReadOnlyList<double> PercentileKelvin,
    double MaxKelvin,
    double MeanKelvin,
    double StandardDeviationKelvin);

/// <summary>One tolerance's share of the variance of the error, from a linear fit of the error on the deviations.</summary>
public sealed record VarianceShare(string Key, ToleranceKind? Kind, double Share, double KelvinPerUnit);

/// <summary>A histogram of the units' worst errors, for plots.</summary>
public sealed record Histogram(double[] LowerEdgesKelvin, double BinWidthKelvin, int[] Counts);

/// <summary>
/// Everything a Monte Carlo run found; the contributors are ranked at <see cref="ContributorsCelsius"/>, where the
/// units spread most, and <see cref="VarianceKelvinSquared"/> is the unquantised error's variance there; the per-unit arrays (indexed by unit) are there for plots and further analysis; <see cref="UnitWithinBudget"/> says whether each unit met the budget, regions included, at every temperature.</summary>
public sealed record MonteCarloResult(
    int Units,
    ulong Seed,
    IReadOnlyList<ToleranceParameter> Parameters,
    IReadOnlyList<double> Percentiles,
    IReadOnlyList<EnvelopePoint> Envelope,
    int UnitsWithinBudget,
    double ContributorsCelsius,
    double VarianceKelvinSquared,
    IReadOnlyList<VarianceShare> Contributors,
    Histogram WorstErrors,
    double[] WorstErrorKelvin,
    double[] WorstCelsius,
    double[][] Deviations,
    double MaximumSelfHeatingKelvin,
    bool[] UnitWithinBudget)
{
    /// <summary>
    /// The largest margin each unit's error had to leave inside the budget: the nominal design's noise at its coverage
    /// plus its lag on the declared ramp (counted at every temperature, as the check counts it).
    /// </summary>
    public double LargestNoiseKelvin { get; init; }

    /// <summary>A delta-sigma design with each unit's channel switch simulated (DeltaSigmaUnit); null otherwise.</summary>
    public UnitChannelSwitch? ChannelSwitch { get; init; }

    /// <summary>Fraction of units within the budget at every temperature.</summary>
    public double Yield => (double)UnitsWithinBudget / Units;

    /// <summary>Binomial standard error of <see cref="Yield"/>: √(y(1 − y)/N).</summary>
    public double YieldStandardError => Math.Sqrt(Yield * (1 - Yield) / Units);
}
