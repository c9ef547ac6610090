namespace Sibyl.Server.Internal;

/// <summary>The emulators a server has loaded, by name.</summary>
internal sealed class EmulatorCatalog : IDisposable
{
    private readonly Dictionary<string, ServedEmulator> _byName;

    public EmulatorCatalog(IReadOnlyList<ServedEmulator> emulators, SibylServerOptions options)
    {
        All = emulators;
        Options = options;
        _byName = emulators.ToDictionary(e => e.Name, StringComparer.Ordinal);
    }

    public IReadOnlyList<ServedEmulator> All { get; }

    public SibylServerOptions Options { get; }

    /// <exception cref="RequestRejectedException">Empty or unknown name.</exception>
    public ServedEmulator Find(string name)
    {
        if (name.Length == 0)
        {
            throw StatusMapping.Invalid($"emulator: required; this server has {Names()}");
        }

        return _byName.TryGetValue(name, out var emulator)
            ? emulator
            : throw StatusMapping.NotFound($"emulator '{name}' is not loaded; this server has {Names()}");
    }

    public void Dispose()
    {
        foreach (var e in All)
        {
            e.Dispose();
        }
    }

    private string Names() => string.Join(", ", All.Select(e => e.Name));
}
