using ThermVerify.FrontEnd;
using ThermVerify.Ngspice;

namespace ThermVerify.Cli;

/// <summary>The names of the engines on the command line and the engine each one makes.</summary>
internal static class EngineChoice
{
    public const string BuiltIn = "built-in";
    public const string Ngspice = "ngspice";

    /// <summary>The engine, to be disposed when the run ends (ngspice's worker process stops then).</summary>
    public static ChosenEngine Create(string name, bool childProcess) => name switch
    {
        Ngspice => new ChosenEngine(new NgspiceEngine(childProcess ? NgspiceMode.ChildProcess : NgspiceMode.SharedLibrary)),
        _ when childProcess => throw new UsageException("--ngspice-process goes with --engine ngspice."),
        _ => new ChosenEngine(BuiltInEngine.Instance),
    };
}

/// <summary>An engine for one run; disposing it stops what it started.</summary>
internal sealed class ChosenEngine(ICheckEngine engine) : IDisposable
{
    public ICheckEngine Engine { get; } = engine;

    public void Dispose() => (Engine as IDisposable)?.Dispose();
}
