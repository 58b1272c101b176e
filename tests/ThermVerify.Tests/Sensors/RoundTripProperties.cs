using FsCheck;
using FsCheck.Fluent;
using FsCheck.Xunit;
using ThermVerify.Sensors;

namespace ThermVerify.Tests.Sensors;

/// <summary>
/// Round trips and slopes over each model's whole valid range. The references are the models' own forward
/// equations (each checked against its source in the model's test class) and a central finite difference.
/// </summary>
public class RoundTripProperties
{
    public static TheoryData<string> Models => ["beta", "steinhart-hart", "steinhart-hart-4", "table", "pt100", "pt1000"];

    private static ISensorModel Make(string name) => name switch
    {
        "beta" => TestSensors.Beta10k(),
        "steinhart-hart" => TestSensors.SteinhartHart(),
        "steinhart-hart-4" => TestSensors.SteinhartHartFourTerm(),
        "table" => TableThermistor.FromPoints(TestSensors.Rows(TestSensors.SteinhartHart(), 5)),
        "pt100" => TestSensors.Pt100(),
        "pt1000" => new PlatinumRtd(1000),
        _ => throw new ArgumentException(name),
    };

    /// <summary>A fraction in [0, 1] with both ends included.</summary>
    private static Arbitrary<double> Fraction => Gen.Choose(0, 1_000_000).Select(i => i / 1e6).ToArbitrary();

    private static double At(TemperatureRange range, double fraction, double inset = 0) =>
        range.MinCelsius + inset + fraction * (range.MaxCelsius - range.MinCelsius - 2 * inset);

    [Theory]
    [MemberData(nameof(Models))]
    public void Temperature_round_trip_within_a_microkelvin(string name)
    {
        // Task requirement is 1 mK for the RTD; every model here does far better, so 1 µK is asserted.
        var model = Make(name);
        Prop.ForAll(Fraction, f =>
        {
            var t = At(model.ValidRange, f);
            var back = model.TemperatureCelsius(model.ResistanceOhms(t));
            return Tolerance.Within(back, t, rel: 0, abs: 1e-6).Label($"{name}: {t} °C → {back} °C");
        }).QuickCheckThrowOnFailure();
    }

    [Theory]
    [MemberData(nameof(Models))]
    public void Resistance_round_trip_within_1e_12_relative(string name)
    {
        var model = Make(name);
        var r1 = model.ResistanceOhms(model.ValidRange.MinCelsius);
        var r2 = model.ResistanceOhms(model.ValidRange.MaxCelsius);
        var (lo, hi) = (Math.Min(r1, r2), Math.Max(r1, r2));
        Prop.ForAll(Fraction, f =>
        {
            // Sampled evenly in ln R, because NTC resistance spans decades.
            var r = Math.Clamp(lo * Math.Pow(hi / lo, f), lo, hi);
            var back = model.ResistanceOhms(model.TemperatureCelsius(r));
            return Tolerance.Within(back, r, rel: 1e-12).Label($"{name}: {r} Ω → {back} Ω");
        }).QuickCheckThrowOnFailure();
    }

    [Theory]
    [MemberData(nameof(Models))]
    public void Slope_matches_a_central_difference(string name)
    {
        // Central difference with h = 1 mK: truncation error h²/6·R''' is far below 1e-5 relative for these curves;
        // the table's cubic pieces have a second derivative that jumps at rows, hence its looser 1e-4.
        var model = Make(name);
        const double h = 1e-3;
        var rel = name == "table" ? 1e-4 : 1e-6;
        Prop.ForAll(Fraction, f =>
        {
            var t = At(model.ValidRange, f, inset: h);
            var central = (model.ResistanceOhms(t + h) - model.ResistanceOhms(t - h)) / (2 * h);
            var slope = model.SlopeOhmsPerKelvin(t);
            return Tolerance.Within(slope, central, rel).Label($"{name}: at {t} °C slope {slope}, central {central}");
        }).QuickCheckThrowOnFailure();
    }
}
