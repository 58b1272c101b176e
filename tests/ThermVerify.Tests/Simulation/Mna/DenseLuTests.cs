using Complex = System.Numerics.Complex;
using MathNet.Numerics.LinearAlgebra;
using ThermVerify.Circuits;
using ThermVerify.Simulation;
using ThermVerify.Simulation.Mna;

namespace ThermVerify.Tests.Simulation.Mna;

/// <summary>
/// The one LU for real and complex systems: solutions against MathNet.Numerics' LU, the condition estimate
/// against the exact 1-norm condition number, and the MNA case that defeats plain partial pivoting (against the
/// exact rational solution).
/// </summary>
public class DenseLuTests
{
    private static Matrix<double> RandomReal(Random random, int n) =>
        Matrix<double>.Build.Dense(n, n, (_, _) => random.NextDouble() * 2 - 1) + Matrix<double>.Build.DenseIdentity(n) * n / 4.0;

    private static double[] Flat(Matrix<double> m) => [.. Enumerable.Range(0, m.RowCount * m.ColumnCount).Select(k => m[k / m.ColumnCount, k % m.ColumnCount])];

    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    [InlineData(7)]
    [InlineData(30)]
    public void Real_solve_and_transposed_solve_agree_with_mathnet(int n)
    {
        var random = new Random(n);
        var a = RandomReal(random, n);
        // Rows and columns of wildly different scale, as MNA has: the answer must not care.
        for (var i = 0; i < n; i++)
        {
            a.SetRow(i, a.Row(i) * Math.Pow(10, random.Next(-12, 12)));
            a.SetColumn((i * 7 + 3) % n, a.Column((i * 7 + 3) % n) * Math.Pow(10, random.Next(-6, 6)));
        }
        var b = Vector<double>.Build.Dense(n, i => random.NextDouble() - 0.5);
        var lu = new DenseLu<double>(n);
        Assert.Equal(-1, lu.Factor(Flat(a)));
        var x = new double[n + 1];
        lu.Solve([.. b, 0], x);
        var xt = new double[n + 1];
        lu.SolveTransposed([.. b, 0], xt);
        // Reference: MathNet.Numerics' LU (an independent implementation). Both are backward stable here, so the
        // solutions agree to a small multiple of the condition number times the unit roundoff.
        var expected = a.LU().Solve(b);
        var expectedT = a.Transpose().LU().Solve(b);
        for (var i = 0; i < n; i++)
        {
            Tolerance.AssertClose(expected[i], x[i], 1e-9, 1e-14 * expected.AbsoluteMaximum(), $"x[{i}]");
            Tolerance.AssertClose(expectedT[i], xt[i], 1e-9, 1e-14 * expectedT.AbsoluteMaximum(), $"xᵀ[{i}]");
        }
    }

    [Fact]
    public void Complex_solve_and_transposed_solve_agree_with_mathnet()
    {
        const int n = 12;
        var random = new Random(5);
        var a = Matrix<Complex>.Build.Dense(n, n, (i, j) => new Complex(random.NextDouble() - 0.5, random.NextDouble() - 0.5) + (i == j ? 3 : 0));
        var b = Vector<Complex>.Build.Dense(n, i => new Complex(i, 1 - i));
        var lu = new DenseLu<Complex>(n);
        Assert.Equal(-1, lu.Factor([.. Enumerable.Range(0, n * n).Select(k => a[k / n, k % n])]));
        var x = new Complex[n];
        var xt = new Complex[n];
        lu.Solve([.. b], x);
        lu.SolveTransposed([.. b], xt);
        // Reference: MathNet.Numerics' complex LU; Aᵀ is the plain transpose (adjoint noise analysis needs it, not Aᴴ).
        var expected = a.LU().Solve(b);
        var expectedT = a.Transpose().LU().Solve(b);
        for (var i = 0; i < n; i++)
        {
            Tolerance.AssertClose(0, (expected[i] - x[i]).Magnitude, 0, 1e-13 * expected.AbsoluteMaximum().Magnitude, $"x[{i}]");
            Tolerance.AssertClose(0, (expectedT[i] - xt[i]).Magnitude, 0, 1e-13 * expectedT.AbsoluteMaximum().Magnitude, $"xᵀ[{i}]");
        }
    }

    /// <summary>
    /// The minimal case (our own instance): a follower (A0 9.3e3, GBW 112 kHz, second pole 7 MHz, r_o 633 Ω,
    /// 3.3 mV offset) driven to 4.64 V by two DC sources and a divider, so it saturates at its 3.25 V limit with the pole
    /// nodes at 12.9 kV, into 1 kΩ and 1 nF. Its transient matrix at a short trapezoidal step, where the pole
    /// capacitors' companion conductances reach 1e10 S and more.
    /// </summary>
    internal static (double[] Matrix, double[] Rhs, BoundSystem System) SaturatedFollowerStep(double stepSeconds)
    {
        var circuit = new CircuitBuilder()
            .VoltageSource("V1", "vin", "0", 5)
            .VoltageSource("V2", "ref", "0", 1)
            .Resistor("R1", "vin", "a", 1e3)
            .Resistor("R2", "a", "ref", 10e3)
            .Add(new OpAmp("U1", "a", "out", "out")
            {
                OpenLoopGain = 9.3e3, GainBandwidthHertz = 112e3, SecondPoleHertz = 7e6, OutputResistanceOhms = 633,
                InputOffsetVolts = 3.3e-3, OutputLowVolts = 0.05, OutputHighVolts = 3.25,
            })
            .Resistor("R3", "out", "c", 1e3)
            .Capacitor("C1", "c", "0", 1e-9)
            .Build();
        var system = new BoundSystem(circuit);
        DcSolver.Solve(system, "test", null);
        var c = system.Context;
        foreach (var s in system.Reactive)
            s.Accept(c);
        (c.State, c.PreviousState) = (c.PreviousState, c.State);
        c.Mode = AnalysisMode.Transient;
        StepFormulas.Apply(c, StepFormula.Trapezoidal, stepSeconds, stepSeconds);
        system.Assemble();
        return ([.. c.Matrix], [.. c.Rhs], system);
    }

    [Theory]
    [InlineData(1e-12)]
    [InlineData(1e-15)]
    [InlineData(1e-18)]
    public void A_saturated_followers_pole_row_does_not_spoil_its_input_node(double stepSeconds)
    {
        var (matrix, rhs, system) = SaturatedFollowerStep(stepSeconds);
        var n = system.Size;
        var a = new double[n, n];
        for (var i = 0; i < n; i++)
            for (var j = 0; j < n; j++)
                a[i, j] = matrix[i * n + j];
        // Reference: the exact solution of the same floating-point system in rational arithmetic.
        var exact = ExactLinearSolve.Solve(a, rhs[..n]);
        var lu = new DenseLu<double>(n);
        Assert.Equal(-1, lu.Factor(matrix));
        var x = new double[n + 1];
        lu.Solve(rhs, x);
        for (var i = 0; i < n; i++)
            // Within two units in the last place of each unknown (1e-18 A for currents that are differences near 0).
            Tolerance.AssertClose(exact[i], x[i], 4.5e-16, 1e-18, system.Layout.UnknownNames[i]);
        Assert.InRange(lu.ConditionNumber, 1, 100);

        // Plain partial pivoting (MathNet.Numerics' LU) takes the pole row's g_m as the pivot of column 'a' and mixes the
        // 1e10 S companion conductance and its 1e14 A history current into V(a): digits go as 1/h (issue: "~10 digits lost").
        var plain = Matrix<double>.Build.DenseOfArray(a).LU().Solve(Vector<double>.Build.DenseOfArray(rhs[..n]));
        var index = system.Layout.IndexOfNode("a");
        Assert.True(Math.Abs(plain[index] - exact[index]) > 1e-8, $"plain partial pivoting error {Math.Abs(plain[index] - exact[index]):G3} V");
    }

    [Theory]
    [InlineData(3)]
    [InlineData(6)]
    [InlineData(20)]
    public void One_norm_estimate_is_a_lower_bound_within_a_factor_three_of_the_exact_norm(int n)
    {
        for (var seed = 0; seed < 20; seed++)
        {
            var random = new Random(100 * n + seed);
            var b = RandomReal(random, n).Inverse();
            var estimator = new OneNormEstimator<double>(n);
            var estimate = estimator.Estimate(v => b.Multiply(Vector<double>.Build.DenseOfArray(v)).CopyTo(Vector<double>.Build.Dense(v)),
                v => b.TransposeThisAndMultiply(Vector<double>.Build.DenseOfArray(v)).CopyTo(Vector<double>.Build.Dense(v)));
            // ‖B‖₁ = largest column sum (MathNet L1Norm). Hager's estimate is a lower bound (it is ‖B·x‖₁ for a unit x)
            // and in practice within a factor of 3 (Higham 1988).
            var exact = b.L1Norm();
            Assert.InRange(estimate, exact / 3, exact * (1 + 1e-12));
        }
    }

    [Fact]
    public void Nearly_dependent_rows_give_a_large_condition_number()
    {
        // Rows 1 and 2 differ by 1e-11: the matrix is within 1e-11 of singular, κ ≈ 1e11 (any linear-algebra text).
        var a = Matrix<double>.Build.DenseOfArray(new[,]
        {
            { 4, 1, 0, 0 },
            { 0, 1, 1, 0 },
            { 0, 1, 1 + 1e-11, 0 },
            { 0, 0, 1, 2 },
        });
        var lu = new DenseLu<double>(4);
        Assert.Equal(-1, lu.Factor(Flat(a)));
        Assert.InRange(lu.ConditionNumber, 1e10, 1e13);
        var identity = new DenseLu<double>(4);
        identity.Factor(Flat(Matrix<double>.Build.DenseIdentity(4) * 1e-9));
        Tolerance.AssertClose(1, identity.ConditionNumber, 1e-12);
    }

    [Theory]
    [InlineData(false)]
    [InlineData(true)]
    public void Componentwise_amplification_matches_its_definition(bool transposed)
    {
        const int n = 9;
        var random = new Random(9);
        var a = RandomReal(random, n);
        for (var i = 0; i < n; i++)
            a.SetRow(i, a.Row(i) * Math.Pow(10, random.Next(-8, 8)));
        var lu = new DenseLu<double>(n);
        Assert.Equal(-1, lu.Factor(Flat(a)));
        var x = Enumerable.Range(0, n).Select(i => (random.NextDouble() - 0.5) * Math.Pow(10, random.Next(-3, 3))).ToArray();
        var weights = x.Select(v => 1 / (Math.Abs(v) + 1e-3)).ToArray();
        // Definition (Skeel 1979): w_i·(|A⁻¹|·|A|·|x|)_i, computed with MathNet.Numerics' inverse (for Aᵀ with Aᵀ).
        var m = transposed ? a.Transpose() : a;
        var exact = m.Inverse().PointwiseAbs() * (m.PointwiseAbs() * Vector<double>.Build.DenseOfArray(x).PointwiseAbs());
        var perUnknown = lu.ErrorAmplificationPerUnknown(x, weights, transposed);
        for (var i = 0; i < n; i++)
            Tolerance.AssertClose(weights[i] * exact[i], perUnknown[i], 1e-8, 0, $"unknown {i}");
        // Hager's estimate of the largest is a lower bound within a factor of 3 (Higham 1988).
        var largest = perUnknown.Max();
        Assert.InRange(lu.ErrorAmplification(x, weights, transposed), largest / 3, largest * (1 + 1e-9));
    }

    [Fact]
    public void An_empty_row_or_a_dependent_column_is_reported_by_its_unknown()
    {
        var lu = new DenseLu<double>(3);
        Assert.Equal(1, lu.Factor([1, 0, 0, 0, 0, 0, 0, 0, 1]));
        Assert.Equal(2, lu.Factor([1, 0, 1, 0, 1, 1, 1, 1, 2]));
    }
}
