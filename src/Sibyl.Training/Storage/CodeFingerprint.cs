using System.Security.Cryptography;
using System.Text;
using Sibyl.Cosmology;
using Sibyl.Perturbation.Spectra;

namespace Sibyl.Training.Storage;

/// <summary>
/// Identifies the code that computed a result. The solution builds deterministically, so each assembly's module
/// version id is a hash of its compiled content: the same sources and compiler give the same fingerprint on every
/// node of a cluster, and any change to the physics or training code gives a new one. Merging refuses results of
/// different fingerprints, which would otherwise mix two versions of the physics in one training set.
/// </summary>
public static class CodeFingerprint
{
    /// <summary>The fingerprint of the running build: 16 hex digits.</summary>
    public static string Current { get; } = Compute();

    private static string Compute()
    {
        var text = new StringBuilder();
        foreach (var type in new[] { typeof(CosmologyModel), typeof(BasisSpectra), typeof(CodeFingerprint) })
        {
            text.Append(type.Assembly.GetName().Name).Append(':').Append(type.Module.ModuleVersionId.ToString("N")).Append(';');
        }

        return Convert.ToHexStringLower(SHA256.HashData(Encoding.UTF8.GetBytes(text.ToString())))[..16];
    }
}
