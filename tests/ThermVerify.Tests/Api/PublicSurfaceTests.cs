using System.Reflection;
using ThermVerify.Api;

namespace ThermVerify.Tests.Api;

/// <summary>
/// Internal by default: every public type of the library is reached from the front door (Verifier and the other
/// Api types), a renderer, an engine or an exception, through the public members a program can call.
/// </summary>
public class PublicSurfaceTests
{
    private static readonly Assembly Library = typeof(Verifier).Assembly;

    [Fact]
    public void Every_public_type_is_reached_from_the_front_door()
    {
        var seeds = Library.GetExportedTypes().Where(t =>
            t.Namespace == "ThermVerify.Api"
            || (t.Namespace?.StartsWith("ThermVerify.Reporting", StringComparison.Ordinal) == true && t.IsAbstract && t.IsSealed) // static renderers
            || typeof(Exception).IsAssignableFrom(t)
            || t == typeof(ThermVerify.FrontEnd.BuiltInEngine)
            || t == typeof(ThermVerify.Baselines.BaselineFile) || t == typeof(ThermVerify.Firmware.CHeaderRenderer) || t == typeof(ThermVerify.Firmware.TableCsvRenderer)).ToList();
        var reached = Reach(seeds);
        // Public only so that test theories may take them as parameters (xUnit needs public parameter types).
        Type[] forTheories = [typeof(ThermVerify.Quantities.UnitKind), typeof(ThermVerify.Simulation.IntegrationMethod)];
        var stray = Library.GetExportedTypes().Where(t => !reached.Contains(t) && !forTheories.Contains(t)).Select(t => t.FullName).Order().ToList();
        Assert.True(stray.Count == 0, "public types nothing public reaches (make them internal):\n" + string.Join("\n", stray));
    }

    [Fact]
    public void The_walk_finds_a_type_only_through_a_public_member()
    {
        var reached = Reach([typeof(Sample)], typeof(Sample).Assembly);
        Assert.Contains(typeof(Uri), reached);
        Assert.DoesNotContain(typeof(Version), reached);
    }

    /// <summary>Every type the seeds' public members mention, following the members of the types of <paramref name="home"/> only.</summary>
    private static HashSet<Type> Reach(IEnumerable<Type> seeds, Assembly? home = null)
    {
        home ??= Library;
        var reached = new HashSet<Type>();
        var queue = new Queue<Type>(seeds);
        while (queue.Count > 0)
        {
            var type = queue.Dequeue();
            if (type.IsGenericType && !type.IsGenericTypeDefinition) type = type.GetGenericTypeDefinition();
            if (!reached.Add(type) || type.Assembly != home) continue;
            foreach (var t in Mentioned(type)) queue.Enqueue(t);
        }
        return reached;
    }

    private static IEnumerable<Type> Mentioned(Type type)
    {
        const BindingFlags flags = BindingFlags.Public | BindingFlags.Instance | BindingFlags.Static | BindingFlags.DeclaredOnly;
        var direct = new List<Type>();
        if (type.BaseType is { } b) direct.Add(b);
        direct.AddRange(type.GetInterfaces());
        direct.AddRange(type.GetNestedTypes(BindingFlags.Public));
        foreach (var m in type.GetMembers(flags))
            switch (m)
            {
                case PropertyInfo p: direct.Add(p.PropertyType); break;
                case FieldInfo f: direct.Add(f.FieldType); break;
                case MethodBase method:
                    direct.AddRange(method.GetParameters().Select(p => p.ParameterType));
                    if (method is MethodInfo info) direct.Add(info.ReturnType);
                    break;
            }
        return direct.SelectMany(Unwrap);
    }

    private static IEnumerable<Type> Unwrap(Type t)
    {
        if (t.HasElementType) return Unwrap(t.GetElementType()!);
        if (t.IsGenericType) return t.GetGenericArguments().SelectMany(Unwrap).Append(t);
        return [t];
    }

    public sealed class Sample
    {
        public Uri? Address { get; init; }
        internal Version? Hidden { get; init; }
    }
}
