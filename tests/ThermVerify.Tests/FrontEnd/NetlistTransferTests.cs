using ThermVerify.Design;
using ThermVerify.FrontEnd;

namespace ThermVerify.Tests.FrontEnd;

/// <summary>
/// The closed form of a netlist, found from solves of its ideal form, against the same network worked by hand with
/// Ohm's and Kirchhoff's laws (textbook circuit analysis, no source needed): the kiln vent's divider with a
/// linearising resistor in parallel with the NTC, read through two RC stages that carry no DC current.
/// </summary>
public class NetlistTransferTests
{
    private static readonly NetlistSpec Kiln = DesignLoader.Load(Path.Combine(Repository.Netlists, "kiln-vent-two-stage.toml")).Netlist!;

    private static double Parallel(double a, double b) => a * b / (a + b);

    [Theory]
    [InlineData(300.0)]
    [InlineData(4_000.0)]
    [InlineData(10_000.0)]
    [InlineData(250_000.0)]
    public void The_ideal_transfer_is_the_divider_worked_by_hand(double sensorOhms)
    {
        const double rail = 3.3, top = 6.8e3, linear = 22e3, first = 4.7e3, second = 1e3;
        var lower = Parallel(sensorOhms, linear);
        var transfer = NetlistTransfer.Of(Kiln);
        var volts = rail * lower / (lower + top);
        Tolerance.AssertClose(volts, transfer.OutputVolts(sensorOhms), 1e-12);
        Tolerance.AssertClose(sensorOhms, transfer.SensorOhms(volts), 1e-9);
        Tolerance.AssertClose(first + second + Parallel(top, lower), transfer.TheveninOhms(sensorOhms), 1e-12);
        // dV/dR by the chain rule: dV/dR_lower = rail·top/(lower + top)², dR_lower/dR = (linear/(R + linear))².
        var slope = rail * top / Math.Pow(lower + top, 2) * Math.Pow(linear / (sensorOhms + linear), 2);
        Tolerance.AssertClose(slope, transfer.SlopeVoltsPerOhm(sensorOhms), 1e-9);
    }

    [Fact]
    public void A_voltage_no_sensor_can_give_has_no_resistance()
    {
        var transfer = NetlistTransfer.Of(Kiln);
        Assert.True(double.IsNaN(transfer.SensorOhms(3.3 * Parallel(1e30, 22e3) / (Parallel(1e30, 22e3) + 6.8e3) + 0.01)));
        Assert.True(double.IsNaN(transfer.SensorOhms(-0.1)));
    }
}
