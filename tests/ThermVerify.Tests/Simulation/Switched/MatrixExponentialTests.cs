using MathNet.Numerics.LinearAlgebra;
using MathNet.Numerics.LinearAlgebra.Factorization;
using ThermVerify.Simulation.Switched;

namespace ThermVerify.Tests.Simulation.Switched;

/// <summary>The scaling-and-squaring Padé exponential against closed forms and an eigendecomposition.</summary>
public class MatrixExponentialTests
{
    [Fact]
    public void Pade_numerator_of_degree_three_has_the_textbook_coefficients()
    {
        // The (3,3) Padé approximant of e^x is (1 + x/2 + x²/10 + x³/120)/(1 − x/2 + x²/10 − x³/120)
        // (G. A. Baker, P. Graves-Morris, Padé Approximants, from memory).
        double[] expected = [1, 1.0 / 2, 1.0 / 10, 1.0 / 120];
        var c = MatrixExponential.Coefficients(3);
        for (var j = 0; j < expected.Length; j++)
            Tolerance.AssertClose(expected[j], c[j], 1e-15, 0, $"c{j}");
    }

    /// <summary>1×1 matrices whose norms select each Padé degree (3, 5, 7, 9, 13) and the scaling path.</summary>
    [Theory]
    [InlineData(0.01)]
    [InlineData(-0.2)]
    [InlineData(0.9)]
    [InlineData(-2)]
    [InlineData(5)]
    [InlineData(40)]
    [InlineData(-40)]
    public void Scalar_exponential_matches_the_library_exp(double x)
    {
        var e = MatrixExponential.Exp(Matrix<double>.Build.Dense(1, 1, x))[0, 0];
        // e^x itself (Math.Exp, correctly rounded to about 1 ulp); each of the ≤ 6 squarings doubles the relative error.
        Tolerance.AssertClose(Math.Exp(x), e, 1e-13, 0, $"e^{x}");
    }

    [Theory]
    [InlineData(0.1)]
    [InlineData(3)]
    [InlineData(100)]
    public void Rotation_generator_gives_the_rotation_matrix(double angle)
    {
        // exp([[0, −θ], [θ, 0]]) = [[cos θ, −sin θ], [sin θ, cos θ]] (Euler's formula for the generator of rotations).
        var e = MatrixExponential.Exp(Matrix<double>.Build.DenseOfArray(new[,] { { 0, -angle }, { angle, 0 } }));
        // After s squarings the angle error grows like 2^s·ε·θ: 1e-13 absolute at θ = 100.
        Tolerance.AssertClose(Math.Cos(angle), e[0, 0], 0, 1e-13, "cos");
        Tolerance.AssertClose(-Math.Sin(angle), e[0, 1], 0, 1e-13, "−sin");
        Tolerance.AssertClose(Math.Sin(angle), e[1, 0], 0, 1e-13, "sin");
        Tolerance.AssertClose(Math.Cos(angle), e[1, 1], 0, 1e-13, "cos");
    }

    [Fact]
    public void Jordan_block_is_not_diagonalisable_and_still_exact()
    {
        // exp([[λ, 1], [0, λ]]·t) = e^(λt)·[[1, t], [0, 1]] (the nilpotent part's series stops after one term).
        const double lambda = -3, t = 2;
        var e = MatrixExponential.Exp(Matrix<double>.Build.DenseOfArray(new[,] { { lambda * t, t }, { 0, lambda * t } }));
        var decay = Math.Exp(lambda * t);
        Tolerance.AssertClose(decay, e[0, 0], 1e-14, 0, "e^(λt)");
        Tolerance.AssertClose(t * decay, e[0, 1], 1e-14, 0, "t·e^(λt)");
        Tolerance.AssertClose(0, e[1, 0], 0, 1e-300, "below the diagonal");
        Tolerance.AssertClose(decay, e[1, 1], 1e-14, 0, "e^(λt)");
    }

    [Theory]
    [InlineData(1, 0.5)]
    [InlineData(2, 4)]
    [InlineData(3, 60)]
    public void Symmetric_matrices_agree_with_their_eigendecomposition(int seed, double scale)
    {
        // Independent method: MathNet's symmetric eigendecomposition A = V·Λ·Vᵀ, so e^A = V·e^Λ·Vᵀ; agreement to
        // 1e-12 of the largest entry (entries reach 1e37 at the largest scale).
        var random = new Random(seed);
        var b = Matrix<double>.Build.Dense(6, 6, (_, _) => random.NextDouble() * 2 - 1);
        var a = scale * (b + b.Transpose()) / 2;
        var evd = a.Evd(Symmetricity.Symmetric);
        var v = evd.EigenVectors;
        var expected = v * Matrix<double>.Build.DiagonalOfDiagonalVector(evd.EigenValues.Map(l => Math.Exp(l.Real))) * v.Transpose();
        AssertMatrixClose(expected, MatrixExponential.Exp(a), 1e-12);
    }

    [Fact]
    public void Stiff_nonsymmetric_matrix_agrees_with_its_eigendecomposition()
    {
        // A switched-RC-like spectrum: time constants from 1 ns to 1 ms over a 10 µs step (‖A·h‖ ≈ 1e4, 12 squarings).
        // Built as S·Λ·S⁻¹ with a random S; independent method: MathNet's general eigendecomposition, e^A = V·e^Λ·V⁻¹.
        var random = new Random(7);
        double[] rates = [-1e9, -3e7, -2e6, -5e4, -1e3];
        const double h = 1e-5;
        var s = Matrix<double>.Build.Dense(5, 5, (i, j) => (i == j ? 2 : 0) + random.NextDouble() - 0.5);
        var a = s * Matrix<double>.Build.DiagonalOfDiagonalArray([.. rates.Select(l => l * h)]) * s.Inverse();
        var evd = a.Evd(Symmetricity.Asymmetric);
        Assert.All(evd.EigenValues, l => Assert.Equal(0, l.Imaginary, 9));
        var v = evd.EigenVectors;
        var expected = v * Matrix<double>.Build.DiagonalOfDiagonalVector(evd.EigenValues.Map(l => Math.Exp(l.Real))) * v.Inverse();
        // The slow mode e^(−1e3·h) = 0.99 dominates; fast modes vanish. Agreement to 1e-12 of the largest entry.
        AssertMatrixClose(expected, MatrixExponential.Exp(a), 1e-12);
    }

    [Fact]
    public void Exponential_of_a_matrix_times_that_of_its_negative_is_the_identity()
    {
        // e^A·e^(−A) = I, since A and −A commute.
        var random = new Random(11);
        var a = Matrix<double>.Build.Dense(5, 5, (_, _) => 3 * (random.NextDouble() - 0.5));
        AssertMatrixClose(Matrix<double>.Build.DenseIdentity(5), MatrixExponential.Exp(a) * MatrixExponential.Exp(-a), 1e-12);
    }

    /// <summary>Every entry within <paramref name="relative"/> of the largest entry of the expected matrix.</summary>
    private static void AssertMatrixClose(Matrix<double> expected, Matrix<double> actual, double relative)
    {
        var absolute = relative * expected.Enumerate().Max(Math.Abs);
        for (var i = 0; i < expected.RowCount; i++)
            for (var j = 0; j < expected.ColumnCount; j++)
                Tolerance.AssertClose(expected[i, j], actual[i, j], 0, absolute, $"[{i},{j}]");
    }
}
