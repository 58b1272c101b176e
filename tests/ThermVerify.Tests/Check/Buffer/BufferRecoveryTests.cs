using ThermVerify.Check;
using ThermVerify.Check.Buffer;
using ThermVerify.Design;
using ThermVerify.Simulation;

namespace ThermVerify.Tests.Check.Buffer;

public class BufferRecoveryTests
{
    // A slow follower straight into the pin; the sampling capacitor (30 pF behind 1 kΩ) arrives discharged at every acquisition.
    private static readonly FrontEndDesign Design = BufferDesigns.Follower(("buffer.gain_bandwidth", "\"100 kHz\""), ("buffer.slew_rate", "\"0.05 V/us\""),
        ("adc.precharge", "\"discharged\""), ("adc.sampling_capacitance", "\"30 pF\""), ("adc.switch_resistance", "\"1 kohm\""));

    private const double HalfLsb = 3.3 / 4096 / 2;

    private static double Error(double gbw, double? slew) =>
        SettlingError.Volts(Design with { Buffer = Design.Buffer! with { GainBandwidthHertz = gbw, SlewRateVoltsPerSecond = slew } }, 25, 0.0, 0.01 * 2 * HalfLsb);

    /// <summary>As the search counts it: a transient that cannot complete (an op-amp stuck slewing) does not settle.</summary>
    private static bool Settles(double gbw, double? slew)
    {
        try
        {
            return Error(gbw, slew) <= HalfLsb;
        }
        catch (ThermVerify.Simulation.SimulationException)
        {
            return false;
        }
    }

    [Fact]
    public void Needed_gain_bandwidth_and_slew_rate_round_trip_through_the_sampling_transient()
    {
        var r = BufferRecovery.Run(Design, 25, 0.0, search: true);
        // The buffer is the cause: the design misses ½ LSB, an ideal op-amp does not.
        Assert.True(r.SettlingErrorVolts > HalfLsb, $"settling error {r.SettlingErrorVolts} V");
        Assert.True(r.IdealBufferSettlingErrorVolts < HalfLsb, $"ideal {r.IdealBufferSettlingErrorVolts} V");
        Tolerance.AssertClose(r.SettlingErrorVolts - r.IdealBufferSettlingErrorVolts, r.SlewShareVolts + r.BandwidthShareVolts, 1e-12, 1e-18, "shares add up");

        // Round trip (search precision 2 %): the need settles within ½ LSB, 10 % less does not.
        var gbw = Assert.IsType<double>(r.NeededGainBandwidthHertz);
        Assert.True(Error(gbw, null) <= HalfLsb, $"GBW {gbw} Hz: {Error(gbw, null)} V");
        Assert.False(Settles(0.9 * gbw, null), $"GBW {0.9 * gbw} Hz settles");
        var slew = Assert.IsType<double>(r.NeededSlewRateVoltsPerSecond);
        var atGbw = Math.Max(gbw, 100e3);
        Assert.True(Error(atGbw, slew) <= HalfLsb, $"slew {slew} V/s");
        // A need at the search floor means any op-amp down to it settles (BufferRecovery's contract): nothing below is
        // searched. Here it is the floor: once the gain-bandwidth suffices, a slow-slewing output barely reacts to the
        // kickback and recovers through r_o, so every slew rate down to the floor settles.
        if (slew > BufferRecovery.SlewRateFloorVoltsPerSecond)
            Assert.False(Settles(atGbw, 0.9 * slew), $"slew {0.9 * slew} V/s settles");
        else
            Assert.True(Settles(atGbw, slew) && Settles(atGbw, 10 * slew), "settles at and above the floor");
    }
}
