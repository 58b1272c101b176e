using ThermVerify.Ngspice;

namespace ThermVerify.Tests.Ngspice;

public class NgspiceRunnerTests
{
    // A divider with a Beta-model NTC written as a temperature expression; the closed form is the same expression.
    private const string DividerDeck = """
        divider under test
        .options tnom=25 numdgt=15
        .temp 25
        V1 in 0 dc 3.3
        R1 in out 10000
        R2 out 0 r='10000*exp(3950*(1/(temper+273.15)-1/298.15))'
        .dc temp -40 125.001 5
        .end
        """;

    private static double ClosedForm(double celsius)
    {
        var ntc = 10000 * Math.Exp(3950 * (1 / (celsius + 273.15) - 1 / 298.15));
        return 3.3 * ntc / (10000 + ntc); // Ohm's law, divider
    }

    [NgspiceFact]
    public void Shared_library_temperature_sweep_matches_the_divider_formula()
    {
        var plot = NgspiceSession.Run(DividerDeck).Plot("dc");
        AssertDivider(plot);
    }

    [NgspiceFact]
    public void Child_process_temperature_sweep_matches_the_divider_formula()
    {
        var plot = NgspiceProcess.Run(DividerDeck).Plot("dc");
        AssertDivider(plot);
    }

    [NgspiceFact]
    public void Shared_library_reports_a_deck_it_cannot_parse_and_stays_usable()
    {
        var bad = "bad deck\nR1 a 0 1k\nX1 a b nosuchsubckt\n.op\n.end";
        var error = Assert.Throws<NgspiceException>(() => NgspiceSession.Run(bad));
        Assert.Contains("nosuchsubckt", error.Message, StringComparison.OrdinalIgnoreCase);

        var plot = NgspiceSession.Run(DividerDeck).Plot("dc");
        AssertDivider(plot);
    }

    [NgspiceFact]
    public void Child_process_reports_a_deck_it_cannot_parse()
    {
        var bad = "bad deck\nR1 a 0 1k\nX1 a b nosuchsubckt\n.op\n.end";
        Assert.Throws<NgspiceException>(() => NgspiceProcess.Run(bad));
    }

    private static void AssertDivider(NgspicePlot plot)
    {
        var temperatures = plot["temp-sweep"].Real;
        var volts = plot["out"].Real;
        Assert.Equal(34, temperatures.Length);
        for (var i = 0; i < temperatures.Length; i++)
            Tolerance.AssertClose(ClosedForm(temperatures[i]), volts[i], rel: 1e-12, abs: 1e-12, what: $"v(out) at {temperatures[i]} °C");
    }
}
