using ThermVerify.FrontEnd;
using ThermVerify.Ngspice;

namespace ThermVerify.Cli;

/// <summary>The names of the engines on the command line and the engine each one makes.</summary>
internal static class EngineChoice
{
    public const string BuiltIn = "built-in";
    public const string Ngspice = "ngspice";

    public static ICheckEngine Create(string name, bool childProcess) => name switch
    {
        Ngspice => new NgspiceEngine(childProcess ? NgspiceMode.ChildProcess : NgspiceMode.SharedLibrary),
        _ when childProcess => throw new UsageException("--ngspice-process goes with --engine ngspice."),
        _ => BuiltInEngine.Instance,
    };
}
