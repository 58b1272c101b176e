namespace ThermVerify.Firmware;

/// <summary>A table row further from the model than the budget. ModelCelsius is NaN where the model has no temperature for the code.</summary>
public sealed record RowDisagreement(TableRow Row, double ModelCelsius)
{
    public double ErrorKelvin => Row.Celsius - ModelCelsius;
}

public enum TableCauseKind { WrongBeta, WrongFixedResistor, SensorOnOtherSide, SwappedRows, RowOutOfPlace, RowsOutOfOrder, NotMonotonic }

/// <summary>
/// A simple explanation of the disagreements. <see cref="FittedValue"/> is the parameter the table matches (β in K,
/// R_fixed in Ω) where the cause has one; <see cref="ResidualMaxKelvin"/> is the worst row left over once it is
/// assumed (0 for row-order findings).
/// </summary>
public sealed record TableCause(TableCauseKind Kind, string Explanation, double? FittedValue, double ResidualMaxKelvin, IReadOnlyList<int> Lines);

/// <summary>
/// The worst error between the rows of a sparse table, read by straight-line interpolation in °C (firmware rounding
/// to its unit adds at most ½ unit more). Null when the rows cover every code of their span.
/// </summary>
public sealed record InterpolationError(double MaxAbsErrorKelvin, int AtCode);

/// <summary>
/// The outcome of checking a table against the model; <see cref="Passes"/> when every row, and every code between
/// rows, is within the budget and the rows are in code order and monotone.
/// </summary>
public sealed record TableVerification(
    int RowCount,
    double BudgetKelvin,
    double MaxAbsErrorKelvin,
    IReadOnlyList<RowDisagreement> Disagreements,
    IReadOnlyList<TableCause> LikelyCauses,
    InterpolationError? BetweenRows = null)
{
    public bool Passes => Disagreements.Count == 0
        && LikelyCauses.All(c => c.Kind is not (TableCauseKind.RowsOutOfOrder or TableCauseKind.NotMonotonic))
        && !(BetweenRows?.MaxAbsErrorKelvin > BudgetKelvin);
}
