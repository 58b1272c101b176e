using ThermVerify.FrontEnd.DeltaSigma;
using ThermVerify.Simulation.Switched;

namespace ThermVerify.Tests.FrontEnd.DeltaSigma;

/// <summary>
/// The filter's readings of a linear recurrence by powers and geometric sums of its matrix, against the filter's own
/// convolution of the samples stepped one by one (<see cref="SincFilter.Readings"/>, built from the impulse response)
/// and against the geometric series summed by hand.
/// </summary>
public class RecurrenceReadingsTests
{
    [Theory]
    [InlineData(1, 64, 1, true, 0)]
    [InlineData(3, 40, 1, true, 0)]
    [InlineData(3, 40, 1, true, 3)]
    [InlineData(3, 40, 1, false, 2)]
    [InlineData(4, 17, 1, false, 0)]
    [InlineData(2, 25, 4, true, 1)]
    [InlineData(3, 33, 3, false, 5)]
    [InlineData(5, 9, 2, true, 7)]
    public void Readings_of_a_recurrence_equal_the_filters_convolution_of_its_samples(int order, int decimation, int average, bool reset, int early)
    {
        var random = new Random(order * 1000 + decimation * 10 + early);
        foreach (var r in new[] { 1, 2, 4 })
        {
            var sequence = RandomSequence(random, r, early);
            var filter = new SincFilter(order, decimation, average, 1e5);
            const int count = 12;
            const double history = 0.7;
            var expectedReadings = Direct(filter, sequence, history, count, reset);
            var actual = RecurrenceReadings.Of(filter, sequence, history, count, reset);
            Assert.Equal(count, actual.Count);
            for (var k = 0; k < count; k++)
            {
                Assert.Equal(expectedReadings[k].Number, actual[k].Number);
                Assert.Equal(expectedReadings[k].Seconds, actual[k].Seconds, 15);
                // The matrix sums round differently from the tap-by-tap sum: 1e-12 of the value (the steady state is up to c/(1 − 0.995)).
                Tolerance.AssertClose(expectedReadings[k].Value, actual[k].Value, 1e-12, 1e-12, $"r = {r}, reading {k + 1}");
            }
        }
    }

    [Fact]
    public void A_geometric_sequence_through_a_moving_average_is_the_summed_geometric_series()
    {
        // s_n = ρⁿ through sinc1 of M with reset: reading k = (1/M)·Σ_(j<M) ρ^(kM−1−j) = ρ^((k−1)M)·(1 − ρ^M)/(M·(1 − ρ))
        // (the sum of a geometric series, elementary).
        const double rho = 0.993;
        const int m = 100;
        var sequence = new LinearSampleSequence([], 1, [rho], [0], [1], [1], 0);
        var readings = RecurrenceReadings.Of(new SincFilter(1, m, 1, 1e3), sequence, 0, 20, reset: true);
        for (var k = 1; k <= 20; k++)
            Tolerance.AssertClose(Math.Pow(rho, (k - 1) * m) * (1 - Math.Pow(rho, m)) / (m * (1 - rho)), readings[k - 1].Value, 1e-13, 1e-300, $"reading {k}");
    }

    [Fact]
    public void Samples_at_rising_indices_are_the_stepped_samples()
    {
        var sequence = RandomSequence(new Random(5), 3, 4);
        var stepped = sequence.Stepped(5000);
        long[] indices = [0, 2, 3, 4, 5, 105, 205, 305, 1305, 2305, 4999];
        var values = RecurrenceReadings.SamplesAt(sequence, indices);
        for (var i = 0; i < indices.Length; i++)
            Tolerance.AssertClose(stepped[indices[i]], values[i], 1e-12, 1e-12, $"sample {indices[i]}");
    }

    private static IReadOnlyList<FilterReading> Direct(SincFilter filter, LinearSampleSequence sequence, double history, int count, bool reset)
    {
        var length = (1 + (reset ? filter.SettlingConversions - 1 : 0) + count) * filter.SamplesPerReading;
        var samples = sequence.Stepped(length);
        return filter.Readings(n => samples[n], _ => history, count, reset);
    }

    /// <summary>A contracting Φ (a slow mode near 1 and fast ones), an offset, a start and early samples, all of order 1.</summary>
    private static LinearSampleSequence RandomSequence(Random random, int r, int early)
    {
        var phi = new double[r * r];
        for (var i = 0; i < r; i++)
            for (var k = 0; k < r; k++)
                phi[i * r + k] = (random.NextDouble() - 0.5) * 0.2 / r;
        phi[0] = 0.995; // a slow mode, as a reservoir behind a resistor gives
        double[] Vector() => [.. Enumerable.Range(0, r).Select(_ => random.NextDouble() - 0.5)];
        return new LinearSampleSequence([.. Enumerable.Range(0, early).Select(_ => random.NextDouble())], r, phi, Vector(), Vector(), Vector(),
            random.NextDouble());
    }
}
