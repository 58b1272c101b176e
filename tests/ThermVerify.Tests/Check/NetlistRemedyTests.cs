using ThermVerify.Check;
using ThermVerify.Design;

namespace ThermVerify.Tests.Check;

/// <summary>
/// Remedies that name a netlist's own parts (NetlistKnobs): the fixed resistor's value, a [[netlist.part]]'s tempco and
/// a switched excitation's switch_on_lead, each proven by the check of the changed design (RemedyFinder) and held here
/// to its closed form and to a check of the design written with the value.
/// </summary>
public sealed class NetlistRemedyTests : IDisposable
{
    private readonly DirectoryInfo folder = Directory.CreateTempSubdirectory("tv-netlist-remedy-");

    public void Dispose() => folder.Delete(recursive: true);

    private static readonly CheckOptions WithRemedies = new() { ComputeRemedies = true };
    private static readonly CheckOptions NoRemedies = new() { ComputeRemedies = false };

    private string Write(string name, string text)
    {
        var path = Path.Combine(folder.FullName, name);
        File.WriteAllText(path, text);
        return path;
    }

    private const string Leaky = """
        name = "leaky pin behind a high fixed resistor"
        [sensor]
        model = "beta"
        r25 = "10 kohm"
        beta = 3435
        [netlist]
        file = "front.cir"
        sensor = "Rntc"
        pin = "pin"
        reference = "exc"
        excitation = ["Vexc"]
        fixed = "Rtop"
        [adc]
        bits = 12
        reference = "ratiometric"
        sample_rate = "10 Hz"
        acquisition_time = "20 us"
        sampling_capacitance = "5 pF"
        switch_resistance = "1 kohm"
        pin_leakage = "30 nA"
        leakage_doubling = "1000 K"
        precharge = "last-sample"
        [check]
        range = "0 degC .. 50 degC"
        budget = "2 K"
        """;

    private static string Divider(string top) => $"* leaky pin\nVexc exc 0 DC 3.3\nRtop exc pin {top}\nRntc pin 0 10k\n.end\n";

    /// <summary>
    /// 30 nA of pin leakage (doubling every 1000 K: 29.48 nA at 0 °C) through 100 kΩ ∥ the NTC: at 0 °C (R = 28.70 kΩ,
    /// the Beta equation) it moves the pin by more than ½ LSB. Ohm's law gives the largest Thevenin resistance that
    /// keeps it within ½ LSB, and the largest fixed resistor with it: R_f ≤ 1/(I/(½ LSB) − 1/R_s).
    /// </summary>
    [Fact]
    public void The_fixed_resistor_s_value_is_a_remedy_for_pin_leakage()
    {
        Write("front.cir", Divider("100k"));
        var result = FrontEndCheck.Run(DesignLoader.Load(Write("design.toml", Leaky)), WithRemedies);
        var loading = Assert.Single(result.Findings, f => f.Id == "dc-loading");
        var remedy = Assert.Single(loading.Remedies, r => r.Key.StartsWith("netlist.fixed"));
        var halfLsb = 3.3 / 4096 / 2;
        var leakage = 30e-9 * Math.Pow(2, -25.0 / 1000);
        var sensor = 10e3 * Math.Exp(3435 * (1 / 273.15 - 1 / 298.15));
        var closedForm = 1 / (leakage / halfLsb - 1 / sensor);
        Assert.InRange(remedy.Value!.Value, 0.97 * closedForm, closedForm);
        // The design with that value, written into the netlist: the finding is gone.
        Write("front.cir", Divider(remedy.Value.Value.ToString("R", System.Globalization.CultureInfo.InvariantCulture)));
        var changed = FrontEndCheck.Run(DesignLoader.Load(Path.Combine(folder.FullName, "design.toml")), NoRemedies);
        Assert.DoesNotContain(changed.Findings, f => f.Id == "dc-loading");
    }

    /// <summary>
    /// The soil probe as a netlist with its lead cut to 2 ms: switch_on_lead is the remedy for the settling finding after
    /// switch-on. First-order charging (common practice) needs e^(−t/τ)·V ≤ ½ LSB at -10 °C, t ≥ τ·ln(V/(½ LSB)) with
    /// τ = (10 kΩ ∥ 46.3 kΩ)·100 nF; the sampling network's charge and the precharge cases ask a little more, and the
    /// example's 10 ms passes. The [[netlist.part]] Rfixed's tempco is the remedy for its drift: ±50 ppm/K moves the pin
    /// by −843.7 µV at -10 °C, so ½ LSB allows 50·(½ LSB)/843.7 µV ppm/K (drift is linear in the tempco).
    /// </summary>
    [Fact]
    public void The_switch_on_lead_and_a_part_s_tempco_are_remedies()
    {
        Write("soil-probe-switched.cir", File.ReadAllText(Path.Combine(Repository.Netlists, "soil-probe-switched.cir")));
        var text = File.ReadAllText(Path.Combine(Repository.Netlists, "soil-probe-switched-netlist.toml"));
        var result = FrontEndCheck.Run(DesignLoader.Load(Write("short.toml", text.Replace("switch_on_lead = \"10 ms\"", "switch_on_lead = \"2 ms\""))), WithRemedies);

        var settling = Assert.Single(result.Findings, f => f.Id == "settling");
        var lead = Assert.Single(settling.Remedies, r => r.Key == "netlist.switch_on_lead").Value!.Value;
        var sensor = 10e3 * Math.Exp(3435 * (1 / 263.15 - 1 / 298.15));
        var tau = 10e3 * sensor / (10e3 + sensor) * 100e-9;
        var pin = 3.3 * sensor / (10e3 + sensor);
        var halfLsb = 3.3 / 4096 / 2;
        Assert.InRange(lead, tau * Math.Log(pin / halfLsb), 10e-3);
        var relead = FrontEndCheck.Run(DesignLoader.Load(Write("relead.toml",
            text.Replace("switch_on_lead = \"10 ms\"", $"switch_on_lead = \"{lead * 1e3:R} ms\""))), NoRemedies);
        Assert.DoesNotContain(relead.Findings, f => f.Id == "settling");

        var loading = Assert.Single(result.Findings, f => f.Id == "dc-loading");
        var tempco = Assert.Single(loading.Remedies, r => r.Key == "netlist.part.Rfixed.tempco").Value!.Value;
        var allowed = 50e-6 * halfLsb / Math.Abs(loading.EstimateVolts!.Value);
        Assert.InRange(tempco, 0.97 * allowed, allowed);
        var retempco = FrontEndCheck.Run(DesignLoader.Load(Write("retempco.toml",
            text.Replace("tempco = \"50 ppm/K\"", $"tempco = \"{tempco * 1e6:R} ppm/K\""))), NoRemedies);
        Assert.DoesNotContain(retempco.Findings, f => f.Id == "dc-loading");
    }
}
