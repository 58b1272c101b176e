namespace ThermVerify.Simulation.Mna;

/// <summary>
/// When a solution has lost more than half its digits, and the error that says so. The relative error of a
/// solution is bounded by about κ·u (u = 2⁻⁵³ the unit roundoff; Golub &amp; Van Loan, Matrix Computations, §2.7 and
/// §3.5, from memory), so κ above 1/√u ≈ 9.5e7 leaves fewer than half of the 16 digits.
/// </summary>
internal static class MatrixCondition
{
    public static readonly double Limit = 1 / Math.Sqrt(Math.ScaleB(1.0, -53));

    public static IllConditionedMatrixException Exception(MnaLayout layout, double kappa, IReadOnlyList<int> sensitive,
        string analysis, string where)
    {
        var unknowns = sensitive.Take(6).Select(i => layout.UnknownNames[i]).ToList();
        var elements = sensitive.Take(6).SelectMany(i => layout.Touching[i]).Distinct().ToList();
        return new IllConditionedMatrixException(
            $"{analysis}{where}: the circuit matrix is ill-conditioned (estimated condition number {kappa:G2} after scaling, " +
            $"so a solution keeps only about {Math.Max(0, 16 - Math.Log10(kappa)):0} of its 16 digits) at {string.Join(", ", unknowns.Select(u => $"'{u}'"))} " +
            $"(elements: {string.Join(", ", elements)}). Typical causes: a group of nodes tied to each other by small resistances " +
            "but to the rest of the circuit only through a very large one (an open switch, a reverse-biased diode, a leakage path), " +
            "or element values many decades apart on the same node; give such nodes a realistic path to ground or bring the values closer.",
            kappa, unknowns, elements);
    }
}
