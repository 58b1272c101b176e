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

    private const string BrokenAmp = """
        .subckt brokenamp inp inn vcc vee out
        Q1 out inp vee nosuchtransistormodel
        .ends brokenamp
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
    public void A_subcircuit_ngspice_cannot_load_gives_its_error_lines_and_exit_3()
    {
        var run = CliRunner.Run("check", DesignWith(BrokenAmp, "brokenamp"), "-q", "--engine", "ngspice");
        Assert.Equal(ExitCodes.SimulationFailed, run.ExitCode);
        Assert.Contains("ngspice could not run the deck", run.Error);
        Assert.Contains("nosuchtransistormodel", run.Error, StringComparison.OrdinalIgnoreCase);
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
