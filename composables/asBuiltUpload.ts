// Attaches a file to an as-built report with upload progress (XMLHttpRequest: fetch reports no upload progress).
// The server decides the type on the bytes; a refusal (415 type, 413 size) comes back in people's words.
const REFUSED: Record<number, (name: string) => string> = {
  413: name => `"${name}" is larger than the server accepts for one file (25 MiB): attach a smaller trace or photo.`,
  415: name => `"${name}" is not a file the report takes: attach a profilometer CSV or a PNG, JPEG or TIFF photo.`,
}

export function useAsBuiltUpload(base: () => string) {
  const uploading = ref<{ fileName: string; fraction: number } | null>(null)
  const problem = ref<string | null>(null)
  function upload(asBuiltId: string, file: File): Promise<boolean> {
    problem.value = null
    const form = new FormData()
    form.set('file', file, file.name)
    uploading.value = { fileName: file.name, fraction: 0 }
    return new Promise(resolve => {
      const xhr = new XMLHttpRequest()
      xhr.open('POST', `${base()}/${asBuiltId}/files`)
      xhr.upload.onprogress = e => {
        if (e.lengthComputable && uploading.value) uploading.value.fraction = e.loaded / e.total
      }
      xhr.onload = () => {
        uploading.value = null
        if (xhr.status === 201) return resolve(true)
        let json: unknown = null
        try {
          json = JSON.parse(xhr.responseText)
        } catch {
          /* not JSON */
        }
        const server = toApiProblem({ statusCode: xhr.status, data: json })
        problem.value =
          xhr.status === 413 || (xhr.status === 415 && !server.message)
            ? REFUSED[xhr.status]!(file.name)
            : server.message
        resolve(false)
      }
      xhr.onerror = () => {
        uploading.value = null
        problem.value = 'The upload was interrupted; check the connection and try again.'
        resolve(false)
      }
      xhr.send(form)
    })
  }
  return { uploading, problem, upload }
}
