namespace ThermVerify.Ngspice;

/// <summary>The entry point of this assembly when it runs as the ngspice worker process (see <see cref="NgspiceWorker"/>).</summary>
internal static class WorkerProgram
{
    public static int Main(string[] args) => WorkerLoop.Run(args);
}
