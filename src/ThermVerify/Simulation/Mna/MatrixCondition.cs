namespace ThermVerify.Simulation.Mna;

/// <summary>
/// When a solution has lost more than half its digits, and the error that says so. Rounding the matrix entries and
/// the elimination move unknown i by about u·(|A⁻¹|·|A|·|x|)_i (u = 2⁻⁵³, the unit roundoff; Skeel 1979, see
/// <see cref="DenseLu{T}.ErrorAmplification"/>). Each unknown is judged against the circuit's scale: a node voltage
/// against the largest node voltage, a branch current against the largest current in the circuit — the larger of the branch currents and the
/// currents meeting at any node, Σ_j |G_ij·x_j| (a source's current can be the small difference of large ones) — plus
/// Newton's absolute tolerance (1e-12 V, 1e-15 A). Internal voltages of the element models (an op-amp's pole nodes, a
/// diode's junction) are not judged by themselves: whatever of their error matters reaches a circuit node or a
/// branch current, while a saturated op-amp's pole, open-loop at kilovolts behind a flat clamp, may lose digits that
/// nothing sees. An amplification above 1/√u ≈ 9.5e7 leaves fewer than half of the 16 digits of that scale.
/// </summary>
internal static class MatrixCondition
{
    public static readonly double Limit = 1 / Math.Sqrt(Math.ScaleB(1.0, -53));

    private const double VoltageFloor = 1e-12;
    private const double CurrentFloor = 1e-15;

    /// <summary>
    /// 1/scale of every unknown, from the magnitudes of a solution. For an adjoint solution (noise analysis) only the
    /// entries of node and internal-node equations carry noise to the output, so branch equations get weight 0.
    /// </summary>
    /// <param name="nodeCurrents">The largest Σ_j |A_ij·x_j| over the node rows.</param>
    public static void Weights(MnaLayout layout, ReadOnlySpan<double> magnitudes, double nodeCurrents, double[] weights, bool adjoint = false)
    {
        var n = layout.Size;
        double nodes = 0, currents = nodeCurrents;
        for (var i = 0; i < n; i++)
        {
            if (layout.IsCurrent[i])
                currents = Math.Max(currents, magnitudes[i]);
            else if (i < layout.NodeCount)
                nodes = Math.Max(nodes, magnitudes[i]);
        }
        for (var i = 0; i < n; i++)
        {
            var scale = layout.IsCurrent[i] ? currents + CurrentFloor : nodes + VoltageFloor;
            var judged = layout.IsCurrent[i] ? !adjoint : i < layout.NodeCount;
            weights[i] = judged ? 1 / scale : 0;
        }
    }

    /// <summary>Whether some unknown's amplification is above <see cref="Limit"/> (or not a number).</summary>
    public static bool Exceeds(double[] amplification) => amplification.Any(a => !(a <= Limit));

    /// <param name="failure">What went wrong before the matrix was judged (e.g. "did not converge, since …"), or null.</param>
    public static IllConditionedMatrixException Exception(MnaLayout layout, double[] amplification, string analysis, string where,
        string? failure = null)
    {
        var worst = amplification.Max();
        var bad = Enumerable.Range(0, layout.Size).Where(i => amplification[i] > Limit).OrderByDescending(i => amplification[i]).Take(6).ToList();
        var unknowns = bad.Select(i => layout.UnknownNames[i]).ToList();
        var elements = bad.SelectMany(i => layout.Touching[i]).Distinct().ToList();
        var digits = Math.Max(0, Math.Floor(-Math.Log10(worst * Math.ScaleB(1.0, -53))));
        return new IllConditionedMatrixException(
            $"{analysis}{where}{(failure is null ? "" : " " + failure)}: the circuit matrix is ill-conditioned: rounding alone can move {string.Join(", ", unknowns.Select(u => $"'{u}'"))} " +
            $"by {worst:G2} units in the last place of the circuit's scale, so the result keeps only about {digits:0} of its 16 digits there " +
            $"(elements: {string.Join(", ", elements)}). Typical causes: a group of nodes tied to each other by small resistances " +
            "but to the rest of the circuit only through a very large one (an open switch, a reverse-biased diode, a leakage path), " +
            "or element values many decades apart on the same node, or a diode held forward by volts by a source or controlled source " +
            "(nothing then limits its current); give such nodes a realistic path to ground, bring the values closer, or put a resistance in series with the diode.",
            worst, unknowns, elements);
    }
}

