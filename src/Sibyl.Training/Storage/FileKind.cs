namespace Sibyl.Training.Storage;

/// <summary>What a sealed Sibyl file holds; the four-letter tag sits in its header.</summary>
public enum FileKind
{
    /// <summary>A design: spec and points (<c>DSGN</c>).</summary>
    Design,

    /// <summary>One chunk of computed points (<c>CHNK</c>).</summary>
    Chunk,

    /// <summary>A merged training set (<c>TSET</c>).</summary>
    TrainingSet,

    /// <summary>A fitted emulator (<c>EMUL</c>).</summary>
    Emulator,
}
