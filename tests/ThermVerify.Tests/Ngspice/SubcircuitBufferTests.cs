using ThermVerify.Check.Buffer;
using ThermVerify.Circuits;
using ThermVerify.Cli;
using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Ngspice;
using ThermVerify.Sensors;
using ThermVerify.Tests.Cli;

namespace ThermVerify.Tests.Ngspice;

/// <summary>
/// A design whose buffer is the user's own SPICE subcircuit: only ngspice runs it. The subcircuit written here is a
/// plain linear op-amp (offset, bias currents, gain 1e5, 100 Ω out) with the same DC equations as the built-in
/// macro-model the same design gets from its datasheet figures, so the two temperature sweeps must agree.
/// </summary>
public sealed class SubcircuitBufferTests : IDisposable
{
    private const string LinearAmp = """
        * five pins: non-inverting input, inverting input, positive supply, negative supply, output
        .subckt plainamp inp inn vcc vee out
        Vos inp_os inp dc 0.001
        Ibp inp 0 dc 1e-12
        Ibn inn 0 dc 1e-12
        Egain drive 0 inp_os inn 100000
        Rout drive out 100
        .ends plainamp
        """;

    // Accepted by the strict reader, but two voltage sources in parallel leave ngspice no solution.
    private const string BrokenAmp = """
        .subckt brokenamp inp inn vcc vee out
        V1 out vee dc 1
        V2 out vee dc 2
        R1 inp inn 1k
        .ends brokenamp
        """;

    // The built-in macro-model's small-signal structure in SPICE (docs/ngspice.md): gm = A0/1 kΩ into 1 kΩ ∥ C with
    // C = A0/(2π·1 kΩ·GBW), a unity buffer and r_o; A0 = 1e5 (100 dB), GBW = 1 MHz and r_o = 100 Ω as the example's figures.
    private const string SinglePoleAmp = """
        .subckt onepole inp inn vcc vee out
        G1 0 pole inp inn 100
        R1 pole 0 1k
        C1 pole 0 {100000/(2*3.141592653589793*1000*1000000)}
        E1 drive 0 pole 0 1
        Rout drive out 100
        .ends onepole
        """;

    private readonly DirectoryInfo folder = Directory.CreateTempSubdirectory("thermverify-subckt-");

    public void Dispose() => folder.Delete(recursive: true);

    private string DesignWith(string subcircuitText, string subcircuitName)
    {
        File.WriteAllText(Path.Combine(folder.FullName, "amp.lib"), subcircuitText);
        var text = File.ReadAllText(Path.Combine(ExampleDesigns.Folder(), "buffered-cable-probe.toml"))
            .Replace("[buffer]\n", $"[buffer]\nsubckt_file = \"amp.lib\"\nsubckt_name = \"{subcircuitName}\"\n");
        var path = Path.Combine(folder.FullName, "design.toml");
        File.WriteAllText(path, text);
        return path;
    }

    [Fact]
    public void Built_in_engine_refuses_the_subcircuit_and_the_check_exits_2()
    {
        var run = CliRunner.Run("check", DesignWith(LinearAmp, "plainamp"), "-q");
        Assert.Equal(ExitCodes.BadInput, run.ExitCode);
        Assert.Contains("--engine ngspice", run.Error);
        Assert.Contains("plainamp", run.Error);
    }

    [NgspiceFact]
    public void Ngspice_runs_the_subcircuit_and_agrees_with_the_built_in_macro_model_in_dc()
    {
        var withSubcircuit = DesignLoader.Load(DesignWith(LinearAmp, "plainamp"));
        // The subcircuit's offset is a constant: the built-in macro-model gets no drift either.
        var builtIn = withSubcircuit with { Buffer = withSubcircuit.Buffer! with { Subcircuit = null, OffsetDriftVoltsPerKelvin = 0 } };
        var temperatures = SensorTabulation.Grid(builtIn.Check.Range, builtIn.Check.StepKelvin).ToArray();
        var ours = DcLevels.Run(builtIn, [PrechargeCase.LastSample], temperatures);
        var theirs = DcLevels.Run(withSubcircuit, [PrechargeCase.LastSample], temperatures, new NgspiceEngine());
        for (var i = 0; i < temperatures.Length; i++)
            Tolerance.AssertClose(theirs.StaticPinVolts[i], ours.StaticPinVolts[i], 0, 1e-6, $"pin at {temperatures[i]} °C"); // issue's 1 µV limit
    }

    [NgspiceFact]
    public void A_subcircuit_ngspice_cannot_solve_gives_its_error_lines_and_exit_3()
    {
        var run = CliRunner.Run("check", DesignWith(BrokenAmp, "brokenamp"), "-q", "--engine", "ngspice");
        Assert.Equal(ExitCodes.SimulationFailed, run.ExitCode);
        Assert.Contains("ngspice could not run the deck", run.Error);
    }

    [Fact]
    public void A_subcircuit_file_with_elements_outside_the_subset_is_refused_at_load_with_its_position()
    {
        var design = DesignWith(".subckt bad inp inn vcc vee out\nQ1 out inp vee npnmodel\n.ends bad\n", "bad");
        var run = CliRunner.Run("check", design, "-q", "--engine", "ngspice");
        Assert.Equal(ExitCodes.BadInput, run.ExitCode);
        Assert.Contains("amp.lib:2:1: buffer.subckt_file: element Q1: a bipolar transistor (Q) is not accepted", run.Error);
    }

    /// <summary>
    /// The loop gain of the user's subcircuit, measured by ngspice with Middlebrook's voltage injection, against the
    /// built-in macro-model of the same figures measured by Bode's return ratio: two methods and two engines on the
    /// same single-pole amplifier into the same load must give the same crossover and phase margin.
    /// </summary>
    [NgspiceFact]
    public void The_subcircuits_loop_gain_by_injection_in_ngspice_matches_the_macro_models_return_ratio()
    {
        var withSubcircuit = DesignLoader.Load(DesignWith(SinglePoleAmp, "onepole"));
        var builtIn = withSubcircuit with { Buffer = withSubcircuit.Buffer! with { Subcircuit = null, SlewRateVoltsPerSecond = null } };
        using var engine = new NgspiceEngine();
        var theirs = BufferStability.Loop(withSubcircuit, 25, engine);
        var ours = BufferStability.Loop(builtIn, 25);
        Assert.NotNull(ours.CrossoverHertz);
        Tolerance.AssertClose(ours.CrossoverHertz!.Value, theirs.CrossoverHertz!.Value, 1e-3, 0, "crossover");
        Tolerance.AssertClose(ours.PhaseMarginDegrees!.Value, theirs.PhaseMarginDegrees!.Value, 0, 0.1, "phase margin (°)");
    }

    /// <summary>The whole check through ngspice with the user's subcircuit, every buffer section included (a narrow range keeps it short).</summary>
    [NgspiceFact]
    public void Check_with_the_users_subcircuit_runs_end_to_end_through_ngspice_buffer_sections_included()
    {
        var design = DesignWith(SinglePoleAmp, "onepole");
        File.WriteAllText(design, File.ReadAllText(design).Replace("[check]\n", "[check]\nstep = \"10 K\"\n")
            .Replace("range = \"-20 degC .. 100 degC\"", "range = \"20 degC .. 40 degC\""));
        var json = Path.Combine(folder.FullName, "check.json");
        var run = CliRunner.Run("check", design, "--engine", "ngspice", "--no-remedies", "--sampling-points", "2", "--json", json);
        Assert.True(run.ExitCode is ExitCodes.Success or ExitCodes.CheckFailed, run.Error);
        foreach (var section in new[] { "Buffer stability", "Buffer headroom", "Buffer static errors", "Buffer recovery after sampling", "Noise at the ADC" })
            Assert.Contains(section, run.Output);
        Assert.Contains("Middlebrook", run.Output);
        var document = System.Text.Json.JsonDocument.Parse(File.ReadAllText(json));
        Assert.True(document.RootElement.TryGetProperty("buffer", out _));
    }

    [Fact]
    public void A_missing_ngspice_library_maps_to_exit_2_with_the_install_hint()
    {
        var code = ErrorReport.ExitCodeFor(new NgspiceUnavailableException(NgspiceLibrary.InstallHint));
        Assert.Equal(ExitCodes.BadInput, code);
        Assert.Contains("apt-get install libngspice0", NgspiceLibrary.InstallHint);
        Assert.Equal(ExitCodes.BadInput, ErrorReport.ExitCodeFor(new EngineUnsupportedException("x")));
    }
}
